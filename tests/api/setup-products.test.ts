import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/index.js';
import { startApiServer } from '../support/api-server.js';
import { auditOf, demoCharacteristic, demoProduct, parsed, setupApi, signedIn, type Agent } from './setup-fixtures.js';

describe('Setup API: products and characteristics', () => {
  let server: RunningServer;
  let quality: Agent;
  beforeAll(async () => {
    server = await startApiServer();
    quality = await signedIn(server.url, 'quality');
  });
  afterAll(async () => { await server.stop(); });

  it('when quality creates a product and a characteristic, then both are listed and audited with the actor', async () => {
    const created = await quality.post(`${setupApi}/products`, { ...demoProduct('QX-100'), reason: 'new programme' });
    expect(created.status).toBe(201);
    expect(created.body.product).toMatchObject({ code: 'QX-100', motorKind: 'pmsm', resolverPolePairs: 4, ratedVoltageV: 400 });
    const characteristic = await quality.post(`${setupApi}/products/QX-100/characteristics`, demoCharacteristic('bemf.ke'));
    expect(characteristic.status).toBe(201);

    const detail = await quality.get(`${setupApi}/products/QX-100`).expect(200);
    expect(detail.body.characteristics.map((c: { code: string }) => c.code)).toEqual(['bemf.ke']);

    const productAudit = await auditOf(server.db, 'product', 'QX-100');
    expect(productAudit).toHaveLength(1);
    expect(productAudit[0]).toMatchObject({ action: 'product.created', actor: 'Piet Lindqvist', actor_role: 'quality', reason: 'new programme' });
    expect(parsed(productAudit[0].after_json)).toMatchObject({ code: 'QX-100', serialPattern: '^QX\\d{7}$' });
    const characteristicAudit = await auditOf(server.db, 'characteristic', 'QX-100/bemf.ke');
    expect(characteristicAudit.map((e) => e.action)).toEqual(['characteristic.created']);
  });

  it('when a product is edited, then the audit row holds the value before and after', async () => {
    await quality.post(`${setupApi}/products`, demoProduct('QX-110')).expect(201);
    const { code: _code, ...fields } = demoProduct('QX-110', { ratedVoltageV: 480 });
    const edited = await quality.put(`${setupApi}/products/QX-110`, { ...fields, reason: 'rating corrected' });
    expect(edited.status).toBe(200);
    expect(edited.body.product.ratedVoltageV).toBe(480);
    const [, update] = await auditOf(server.db, 'product', 'QX-110');
    expect(update.action).toBe('product.updated');
    expect(parsed(update.before_json).ratedVoltageV).toBe(400);
    expect(parsed(update.after_json).ratedVoltageV).toBe(480);
  });

  it('when the serial pattern is not anchored, then 422 names serialPattern and nothing is stored', async () => {
    for (const serialPattern of ['QX\\d{7}', '^QX|QY$', '^QX(\\d{7}$']) {
      const response = await quality.post(`${setupApi}/products`, demoProduct('QX-120', { serialPattern }));
      expect(response.status).toBe(422);
      expect(response.body.error.fields.map((f: { field: string }) => f.field)).toContain('serialPattern');
    }
    expect(await server.db('products').where({ code: 'QX-120' }).first()).toBeUndefined();
    expect(await auditOf(server.db, 'product', 'QX-120')).toEqual([]);
  });

  it('when a PMSM has no resolver pole pairs or an induction motor has some, then 422 names resolverPolePairs', async () => {
    const pmsm = await quality.post(`${setupApi}/products`, demoProduct('QX-130', { resolverPolePairs: null }));
    expect(pmsm.status).toBe(422);
    expect(pmsm.body.error.fields).toContainEqual(expect.objectContaining({ field: 'resolverPolePairs' }));
    const induction = await quality.post(`${setupApi}/products`, demoProduct('QX-131', { motorKind: 'induction', resolverPolePairs: 2 }));
    expect(induction.status).toBe(422);
    expect(induction.body.error.fields).toContainEqual(expect.objectContaining({ field: 'resolverPolePairs' }));
  });

  it('when a product code is taken, then 409 names the code', async () => {
    await quality.post(`${setupApi}/products`, demoProduct('QX-140')).expect(201);
    const again = await quality.post(`${setupApi}/products`, demoProduct('QX-140'));
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toEqual([{ field: 'code', message: 'Already in use' }]);
  });

  it('when the hipot voltage of a 400 V, 85 kW product is asked, then it is 1000 V + 2·U_N = 1800 V for 60 s', async () => {
    await quality.post(`${setupApi}/products`, demoProduct('QX-150')).expect(201);
    const response = await quality.get(`${setupApi}/products/QX-150/hipot`).expect(200);
    expect(response.body.hipot).toMatchObject({ productCode: 'QX-150', acVrms: 1800, durationS: 60, source: 'IEC 60034-1 Table 16 item 2' });
    expect(response.body.hipot.production.acVrms).toBeCloseTo(2160, 9);
  });

  it('when operator, manager, auditor or admin write a product, then each gets 403 and nothing is stored', async () => {
    for (const login of ['operator', 'manager', 'auditor', 'admin']) {
      const agent = await signedIn(server.url, login);
      const response = await agent.post(`${setupApi}/products`, demoProduct('QX-160'));
      expect(response.status, login).toBe(403);
      expect(response.body.error.code).toBe('forbidden');
    }
    expect(await server.db('products').where({ code: 'QX-160' }).first()).toBeUndefined();
  });
});
