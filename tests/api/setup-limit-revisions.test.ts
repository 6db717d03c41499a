import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/index.js';
import { findLimitSetInForce } from '../../server/services/setup/index.js';
import { startApiServer } from '../support/api-server.js';
import { auditOf, parsed, productWithCharacteristics, setupApi, signedIn, type Agent } from './setup-fixtures.js';

const limits = [
  { characteristicCode: 'bemf.ke', lsl: 48, nominal: 50, usl: 52 },
  { characteristicCode: 'wr.r20', lsl: null, nominal: null, usl: 110 },
];
const soon = () => new Date(Date.now() + 60_000).toISOString();

describe('Setup API: limit revisions', () => {
  let server: RunningServer;
  let quality: Agent;
  let quality2: Agent;
  beforeAll(async () => {
    server = await startApiServer();
    quality = await signedIn(server.url, 'quality');
    quality2 = await signedIn(server.url, 'quality2');
  });
  afterAll(async () => { await server.stop(); });

  async function draftWithLimits(productCode: string) {
    const draft = await quality.post(`${setupApi}/products/${productCode}/limit-sets`, { basis: 'empty' }).expect(201);
    await quality.put(`${setupApi}/limit-sets/${draft.body.limitSet.id}/limits`, { limits }).expect(200);
    return draft.body.limitSet.id as number;
  }

  it('when quality2 approves a draft authored by quality, then it is approved from effectiveFrom and every step is audited', async () => {
    await productWithCharacteristics(quality, 'LR-100');
    const id = await draftWithLimits('LR-100');
    const effectiveFrom = soon();
    const approved = await quality2.post(`${setupApi}/limit-sets/${id}/approve`, { effectiveFrom, reason: 'PPAP limits' });
    expect(approved.status).toBe(200);
    expect(approved.body.limitSet).toMatchObject({
      status: 'approved', revision: 1, authoredByName: 'Piet Lindqvist', approvedByName: 'Ana Sousa', effectiveFrom,
    });
    const audit = await auditOf(server.db, 'limit_set', id);
    expect(audit.map((e) => e.action)).toEqual(['limit_set.draft_created', 'limit_set.limits_edited', 'limit_set.approved']);
    const approval = audit[2];
    expect(approval).toMatchObject({ actor: 'Ana Sousa', actor_role: 'quality', reason: 'PPAP limits' });
    expect(parsed(approval.before_json).status).toBe('draft');
    expect(parsed(approval.after_json)).toMatchObject({ status: 'approved', limits });
  });

  it('when the author approves their own draft, then 403 says a second quality user must and it stays a draft', async () => {
    await productWithCharacteristics(quality, 'LR-110');
    const id = await draftWithLimits('LR-110');
    const response = await quality.post(`${setupApi}/limit-sets/${id}/approve`, { effectiveFrom: soon() });
    expect(response.status).toBe(403);
    expect(response.body.error.message).toMatch(/second quality user/);
    const row = await server.db('limit_sets').where({ id }).first();
    expect(row.status).toBe('draft');
    expect(row.approved_by).toBeNull();
    expect((await auditOf(server.db, 'limit_set', id)).map((e) => e.action)).not.toContain('limit_set.approved');
  });

  it('when a USL lies below the nominal, then 422 names limits[0].usl and the draft keeps its limits', async () => {
    await productWithCharacteristics(quality, 'LR-120');
    const id = await draftWithLimits('LR-120');
    const response = await quality.put(`${setupApi}/limit-sets/${id}/limits`, {
      limits: [{ characteristicCode: 'bemf.ke', lsl: 48, nominal: 50, usl: 49 }],
    });
    expect(response.status).toBe(422);
    expect(response.body.error.fields).toContainEqual({ field: 'limits[0].usl', message: 'USL must not be below the nominal' });
    const stored = await quality.get(`${setupApi}/limit-sets/${id}`).expect(200);
    expect(stored.body.limitSet.limits).toEqual(limits);
  });

  it('when a limit names a characteristic the product lacks, then 422 names limits[i].characteristicCode', async () => {
    await productWithCharacteristics(quality, 'LR-130');
    const draft = await quality.post(`${setupApi}/products/LR-130/limit-sets`, { basis: 'empty' }).expect(201);
    const response = await quality.put(`${setupApi}/limit-sets/${draft.body.limitSet.id}/limits`, {
      limits: [limits[0], { characteristicCode: 'ir.r40', lsl: 100, nominal: null, usl: null }],
    });
    expect(response.status).toBe(422);
    expect(response.body.error.fields.map((f: { field: string }) => f.field)).toEqual(['limits[1].characteristicCode']);
  });

  it('when a copied draft changes one limit, then the difference shows before and after against the revision in force', async () => {
    await productWithCharacteristics(quality, 'LR-140');
    const first = await draftWithLimits('LR-140');
    await quality2.post(`${setupApi}/limit-sets/${first}/approve`, { effectiveFrom: new Date().toISOString() }).expect(200);
    const copy = await quality.post(`${setupApi}/products/LR-140/limit-sets`, { basis: 'in-force' }).expect(201);
    expect(copy.body.limitSet).toMatchObject({ revision: 2, status: 'draft', limits });
    await quality.put(`${setupApi}/limit-sets/${copy.body.limitSet.id}/limits`, {
      limits: [{ ...limits[0], usl: 51.5 }, limits[1]],
    }).expect(200);
    const difference = await quality.get(`${setupApi}/limit-sets/${copy.body.limitSet.id}/difference`).expect(200);
    expect(difference.body.difference).toMatchObject({ comparedWithRevision: 1, changedCount: 1 });
    expect(difference.body.difference.rows[0]).toMatchObject({
      characteristicCode: 'bemf.ke', change: 'changed',
      before: { lsl: 48, nominal: 50, usl: 52 }, after: { lsl: 48, nominal: 50, usl: 51.5 },
    });
    expect(difference.body.difference.rows[1].change).toBe('unchanged');
  });

  it('when revision 2 is approved for later, then revision 1 stays approved and in force until then, revision 2 compares with it, and retiring skips it', async () => {
    await productWithCharacteristics(quality, 'LR-150');
    const first = await draftWithLimits('LR-150');
    await quality2.post(`${setupApi}/limit-sets/${first}/approve`, { effectiveFrom: new Date().toISOString() }).expect(200);
    const second = await draftWithLimits('LR-150');
    const later = new Date(Date.now() + 3_600_000);
    await quality2.post(`${setupApi}/limit-sets/${second}/approve`, { effectiveFrom: later.toISOString() }).expect(200);

    const product = await server.db('products').where({ code: 'LR-150' }).first();
    expect((await findLimitSetInForce(server.db, product.id, new Date()))?.id).toBe(first);
    expect((await findLimitSetInForce(server.db, product.id, new Date(later.getTime() + 1000)))?.id).toBe(second);
    const list = await quality.get(`${setupApi}/products/LR-150/limit-sets`).expect(200);
    expect(list.body.limitSets.map((s: { revision: number; status: string; inForce: boolean }) => [s.revision, s.status, s.inForce]))
      .toEqual([[2, 'approved', false], [1, 'approved', true]]);

    const replaced = await quality.get(`${setupApi}/limit-sets/${second}/difference`).expect(200);
    expect(replaced.body.difference.comparedWithRevision).toBe(1);
    const firstEver = await quality.get(`${setupApi}/limit-sets/${first}/difference`).expect(200);
    expect(firstEver.body.difference).toMatchObject({ comparedWithRevision: null, changedCount: 2 });

    await quality2.post(`${setupApi}/limit-sets/${first}/retire`, { reason: 'superseded' }).expect(200);
    expect(await findLimitSetInForce(server.db, product.id, new Date())).toBeUndefined();
    expect((await auditOf(server.db, 'limit_set', first)).at(-1)).toMatchObject({ action: 'limit_set.retired', reason: 'superseded' });
  });

  it('when quality2 edits or a second draft is started, then the author rule and the one-draft rule refuse it', async () => {
    await productWithCharacteristics(quality, 'LR-160');
    const id = await draftWithLimits('LR-160');
    const foreignEdit = await quality2.put(`${setupApi}/limit-sets/${id}/limits`, { limits });
    expect(foreignEdit.status).toBe(403);
    expect(foreignEdit.body.error.message).toMatch(/only its author edits it/);
    const secondDraft = await quality2.post(`${setupApi}/products/LR-160/limit-sets`, { basis: 'empty' });
    expect(secondDraft.status).toBe(409);
  });

  it('when a draft is discarded, then it is gone and the audit keeps what it held', async () => {
    await productWithCharacteristics(quality, 'LR-170');
    const id = await draftWithLimits('LR-170');
    await quality.post(`${setupApi}/limit-sets/${id}/discard`, { reason: 'wrong product' }).expect(200);
    await quality.get(`${setupApi}/limit-sets/${id}`).expect(404);
    expect(await server.db('limits').where({ limit_set_id: id })).toEqual([]);
    const discard = (await auditOf(server.db, 'limit_set', id)).at(-1);
    expect(discard?.action).toBe('limit_set.draft_discarded');
    expect(parsed(discard?.before_json).limits).toEqual(limits);
  });

  it('when operator, manager, auditor or admin start a draft, then each gets 403', async () => {
    await productWithCharacteristics(quality, 'LR-180');
    for (const login of ['operator', 'manager', 'auditor', 'admin']) {
      const agent = await signedIn(server.url, login);
      const response = await agent.post(`${setupApi}/products/LR-180/limit-sets`, { basis: 'empty' });
      expect(response.status, login).toBe(403);
    }
    const product = await server.db('products').where({ code: 'LR-180' }).first();
    expect(await server.db('limit_sets').where({ product_id: product.id })).toEqual([]);
  });
});
