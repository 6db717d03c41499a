import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { lotListSchema, lotRecordSchema } from '../../server/openapi/response-schemas.js';
import { createLot, createPlant, runDocument, type PlantFixture } from '../factories.js';

describe('lots API: counts, lot record, lot holds and release', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let quality: string;
  let operator: string;
  const get = (path: string) => request(server.url).get(path).set('cookie', operator);
  const write = (path: string, body: object, cookie = quality) => request(server.url).post(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body);

  async function testMotor(lot: string, failing = false) {
    const document = runDocument(plant, { lot });
    if (failing) document.results[2] = { ...document.results[2], value: 12 };
    await ingestTestRun(server.db, document);
    return document.serial;
  }

  beforeAll(async () => {
    server = await startApiServer();
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    // Truncation ends the sessions too, so each test signs in afresh.
    await truncateAll(server.db);
    quality = (await signIn(server.url, 'quality')).cookie;
    operator = (await signIn(server.url, 'operator')).cookie;
    plant = await createPlant(server.db);
  });

  it('when lots are listed, then each carries its motors counted by status, newest lot first, paged', async () => {
    const second = await createLot(server.db, plant.product);
    await testMotor(plant.lot.code);
    await testMotor(plant.lot.code, true);
    await testMotor(second.code);
    const first = lotListSchema.parse((await get('/api/v1/lots?limit=1').expect(200)).body);
    expect(first.items).toEqual([expect.objectContaining({ code: second.code, product: plant.product.code, activeHolds: 0, counts: { motors: 1, passed: 1, failed: 0, onHold: 0, notTested: 0 } })]);
    const next = lotListSchema.parse((await get(`/api/v1/lots?limit=1&cursor=${first.nextCursor}`).expect(200)).body);
    expect(next.items[0]).toMatchObject({ code: plant.lot.code, counts: { motors: 2, passed: 1, failed: 1, onHold: 0, notTested: 0 } });
    expect(next.nextCursor).toBeNull();
  });

  it('when a lot is read, then it has its component lots and its motors', async () => {
    const a = await testMotor(plant.lot.code);
    const b = await testMotor(plant.lot.code, true);
    const lot = lotRecordSchema.parse((await get(`/api/v1/lots/${plant.lot.code}`).expect(200)).body);
    expect(lot.components).toEqual([
      { kind: 'stator', supplierLotCode: `ST-${plant.lot.code}`, supplier: 'Invented Laminations' },
      { kind: 'magnet', supplierLotCode: `MG-${plant.lot.code}`, supplier: 'Invented Magnetics' },
    ]);
    expect(lot.motors.map((m) => [m.serial, m.status])).toEqual([[a, 'passed'], [b, 'failed']]);
  });

  it('when the lot is unknown, then 404', async () => {
    await get('/api/v1/lots/LOT-NOWHERE').expect(404);
    await write('/api/v1/lots/LOT-NOWHERE/holds', { reason: 'contain it' }).expect(404);
  });

  it('when quality holds a lot, then every motor in it is on hold until release restores each own verdict', async () => {
    const passed = await testMotor(plant.lot.code);
    const failed = await testMotor(plant.lot.code, true);
    const hold = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Magnet supplier lot under investigation' }).expect(201);
    expect(hold.body).toMatchObject({ target: { type: 'lot', code: plant.lot.code }, kind: 'manual' });
    const held = lotRecordSchema.parse((await get(`/api/v1/lots/${plant.lot.code}`)).body);
    expect(held.motors.map((m) => m.status)).toEqual(['on hold', 'on hold']);
    expect(held.counts).toMatchObject({ onHold: 2, passed: 0, failed: 0 });
    // A motor tested while its lot is held is on hold too.
    const later = await testMotor(plant.lot.code);
    expect((await get(`/api/v1/motors/${later}`)).body.status).toBe('on hold');

    await write(`/api/v1/holds/${hold.body.id}/release`, { reason: 'Supplier certificate received, magnets in specification' }).expect(200);
    const after = lotRecordSchema.parse((await get(`/api/v1/lots/${plant.lot.code}`)).body);
    expect(Object.fromEntries(after.motors.map((m) => [m.serial, m.status]))).toEqual({ [passed]: 'passed', [failed]: 'failed', [later]: 'passed' });
    expect(after.holds[0]).toMatchObject({ releaseReason: 'Supplier certificate received, magnets in specification' });
    const audit = await server.db('audit_events').where({ entity_type: 'lot', entity_id: plant.lot.code }).orderBy('id');
    expect(audit.map((e) => e.action)).toEqual(['hold.placed', 'hold.released']);
    expect((await get(`/api/v1/motors/${passed}`)).body.auditEvents.map((e: { action: string }) => e.action)).toEqual(['hold.placed', 'hold.released']);
  });

  it('when a motor has its own hold and its lot hold is released, then it stays on hold', async () => {
    const serial = await testMotor(plant.lot.code);
    const lotHold = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Lot containment' }).expect(201);
    await write(`/api/v1/motors/${serial}/holds`, { reason: 'Noise at 3000 rpm reported' }).expect(201);
    await write(`/api/v1/holds/${lotHold.body.id}/release`, { reason: 'Lot cleared' }).expect(200);
    const record = (await get(`/api/v1/motors/${serial}`)).body;
    expect(record.status).toBe('on hold');
    // The record shows its own hold and its lot's, newest first, and both entities' audit events in the order they happened.
    expect(record.holds.map((h: { target: { type: string }; releasedAt: string | null }) => [h.target.type, h.releasedAt === null])).toEqual([['motor', true], ['lot', false]]);
    expect(record.auditEvents.map((e: { entityType: string; action: string }) => [e.entityType, e.action])).toEqual([
      ['lot', 'hold.placed'], ['motor', 'hold.placed'], ['lot', 'hold.released'],
    ]);
  });

  it('when a hold is released twice, then the second answers 409 and the first release stands', async () => {
    await testMotor(plant.lot.code);
    const hold = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Containment' }).expect(201);
    await write(`/api/v1/holds/${hold.body.id}/release`, { reason: 'Cleared' }).expect(200);
    await write(`/api/v1/holds/${hold.body.id}/release`, { reason: 'Cleared again' }).expect(409);
    expect(await server.db('holds').where({ id: hold.body.id }).first()).toMatchObject({ release_reason: 'Cleared' });
    await write('/api/v1/holds/99999/release', { reason: 'Nothing' }).expect(404);
  });

  it('when a hold has no reason, then reason is named and nothing is held', async () => {
    const serial = await testMotor(plant.lot.code);
    const response = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: '' }).expect(422);
    expect(response.body.error.fields[0].field).toBe('reason');
    expect(await server.db('holds').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect((await get(`/api/v1/motors/${serial}`)).body.status).toBe('passed');
  });
});
