import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { clientToken, signIn } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { motorListSchema, motorRecordSchema } from '../../server/openapi/response-schemas.js';
import { createLot, createPlant, createStation, runDocument, type PlantFixture } from '../factories.js';

describe('motors API: list, record, rework notes and motor holds', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let operator: string;
  let quality: string;
  let readerToken: string;
  const get = (path: string, cookie = operator) => request(server.url).get(path).set('cookie', cookie);
  const write = (path: string, body: object, cookie = quality) => request(server.url).post(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body);

  /** Stores a run through the ingest service (as the demo seed does), finishing `minutesAgo`. */
  async function testMotor(overrides: Parameters<typeof runDocument>[1] = {}, minutesAgo = 30, failing = false) {
    const finished = new Date(Date.now() - minutesAgo * 60_000);
    const document = runDocument(plant, { startedAt: new Date(finished.getTime() - 240_000).toISOString(), finishedAt: finished.toISOString(), ...overrides });
    if (failing) document.results[0] = { ...document.results[0], value: 19 };
    await ingestTestRun(server.db, document);
    return document;
  }

  beforeAll(async () => {
    server = await startApiServer();
    readerToken = await clientToken(idpUrl, 'demo-integration', 'demo-integration-secret', { scope: 'records:read' });
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    // Truncation ends the sessions too, so each test signs in afresh.
    await truncateAll(server.db);
    operator = (await signIn(server.url, 'operator')).cookie;
    quality = (await signIn(server.url, 'quality')).cookie;
    plant = await createPlant(server.db);
  });

  it('when motors are listed by serial, then pages follow each other without gaps or repeats', async () => {
    const serials = [];
    for (let i = 0; i < 7; i++) serials.push((await testMotor({}, 60 - i)).serial);
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const response = await get(`/api/v1/motors?limit=3${cursor ? `&cursor=${cursor}` : ''}`).expect(200);
      const page = motorListSchema.parse(response.body);
      seen.push(...page.items.map((m) => m.serial));
      cursor = page.nextCursor;
    } while (cursor);
    expect(seen).toEqual([...serials].sort());
  });

  it('when sorted by lastTestedAt descending, then the newest test comes first and untested motors come last', async () => {
    const old = await testMotor({}, 90);
    const recent = await testMotor({}, 10);
    const middle = await testMotor({}, 50);
    await server.db('motors').insert({ serial: 'FT999999', product_id: plant.product.id, lot_id: plant.lot.id, created_at: new Date() });
    const first = motorListSchema.parse((await get('/api/v1/motors?sort=lastTestedAt&order=desc&limit=2').expect(200)).body);
    expect(first.items.map((m) => m.serial)).toEqual([recent.serial, middle.serial]);
    const second = motorListSchema.parse((await get(`/api/v1/motors?sort=lastTestedAt&order=desc&limit=2&cursor=${first.nextCursor}`).expect(200)).body);
    expect(second.items.map((m) => m.serial)).toEqual([old.serial, 'FT999999']);
    expect(second.items[1]).toMatchObject({ status: 'not tested', lastTestedAt: null });
    expect(second.nextCursor).toBeNull();
    const ascending = motorListSchema.parse((await get('/api/v1/motors?sort=lastTestedAt&order=asc&limit=2').expect(200)).body);
    expect(ascending.items.map((m) => m.serial)).toEqual(['FT999999', old.serial]);
    const rest = motorListSchema.parse((await get(`/api/v1/motors?sort=lastTestedAt&order=asc&cursor=${ascending.nextCursor}`).expect(200)).body);
    expect(rest.items.map((m) => m.serial)).toEqual([middle.serial, recent.serial]);
  });

  it('when filtered by status, lot, station, time and serial prefix, then only matching motors come back', async () => {
    const otherLot = await createLot(server.db, plant.product);
    const passed = await testMotor({ serial: 'FT100001' }, 120);
    const failed = await testMotor({ serial: 'FT100002', lot: otherLot.code }, 30, true);
    const stationB = await createStation(server.db, { clientId: null });
    const onB = await testMotor({ serial: 'FT200001', station: stationB.code }, 20);
    const items = async (query: string) => motorListSchema.parse((await get(`/api/v1/motors?${query}`).expect(200)).body).items.map((m) => m.serial);
    expect(await items('status=failed')).toEqual([failed.serial]);
    expect(await items(`lot=${otherLot.code}`)).toEqual([failed.serial]);
    expect(await items(`station=${stationB.code}`)).toEqual([onB.serial]);
    expect(await items('serialPrefix=FT1')).toEqual([passed.serial, failed.serial]);
    expect(await items(`from=${encodeURIComponent(new Date(Date.now() - 60 * 60_000).toISOString())}`)).toEqual([failed.serial, onB.serial]);
    expect(await items(`product=${plant.product.code}&status=passed`)).toEqual([passed.serial, onB.serial]);
    expect(await items('product=NO-SUCH')).toEqual([]);
  });

  it('when the cursor is not one of ours or the status unknown, then the named field is refused', async () => {
    const bad = await get('/api/v1/motors?cursor=bm90LWEtY3Vyc29y').expect(422);
    expect(bad.body.error.fields[0].field).toBe('cursor');
    expect((await get('/api/v1/motors?status=shipped').expect(422)).body.error.fields[0].field).toBe('status');
  });

  it('when a motor record is read, then it has every run latest first with results, limits and station', async () => {
    const first = await testMotor({}, 60, true);
    await testMotor({ serial: first.serial }, 20);
    const response = await get(`/api/v1/motors/${first.serial}`).expect(200);
    const record = motorRecordSchema.parse(response.body);
    expect(record).toMatchObject({ serial: first.serial, status: 'passed', product: { code: plant.product.code, motorKind: 'pmsm' } });
    expect(record.lot.code).toBe(plant.lot.code);
    expect(record.lot.components.map((c) => c.kind)).toEqual(['stator', 'magnet']);
    expect(record.runs.map((r) => [r.attempt, r.verdict])).toEqual([[2, 'pass'], [1, 'fail']]);
    expect(record.runs[1].runId).toBe(first.runId);
    expect(record.runs[0]).toMatchObject({ station: { code: plant.station.code, line: 'L1' }, limitRevision: 1, calibrationOk: true, operatorBadge: 'B-1042' });
    expect(record.runs[1].results[0]).toEqual({
      characteristic: 'wr.u.r20', name: 'wr.u.r20', unit: 'mΩ', testStep: 'winding-resistance', value: 19, lsl: 20.5, nominal: 21, usl: 21.5, verdict: 'fail',
    });
    expect(record.runs[0].results.map((r) => r.characteristic)).toEqual(plant.product.characteristics.map((c) => c.code));
  });

  it('when an integration client reads a motor with records:read, then it gets the record', async () => {
    const document = await testMotor();
    const response = await request(server.url).get(`/api/v1/motors/${document.serial}`).set('authorization', `Bearer ${readerToken}`).expect(200);
    expect(response.body.serial).toBe(document.serial);
  });

  it('when the serial is unknown, then the record answers 404', async () => {
    expect((await get('/api/v1/motors/FT000000').expect(404)).body.error.code).toBe('not_found');
  });

  it('when an operator records rework and a retest request, then both notes are on the record and audited', async () => {
    const document = await testMotor({}, 30, true);
    const rework = await write(`/api/v1/motors/${document.serial}/rework-notes`, { action: 'rework', note: 'Re-terminated phase U lug' }, operator).expect(201);
    expect(rework.body).toMatchObject({ action: 'rework', note: 'Re-terminated phase U lug', recordedBy: expect.any(String) });
    await write(`/api/v1/motors/${document.serial}/rework-notes`, { action: 'retest', note: 'Retest winding resistance after rework' }, operator).expect(201);
    const record = motorRecordSchema.parse((await get(`/api/v1/motors/${document.serial}`).expect(200)).body);
    expect(record.reworkNotes.map((n) => n.action)).toEqual(['retest', 'rework']);
    expect(record.auditEvents.map((e) => e.action)).toEqual(['rework.recorded', 'retest.requested']);
    expect(record.status).toBe('failed');
  });

  it('when a rework note is empty or its action unknown, then the field is named', async () => {
    const document = await testMotor();
    expect((await write(`/api/v1/motors/${document.serial}/rework-notes`, { action: 'rework', note: ' ' }, operator).expect(422)).body.error.fields[0].field).toBe('note');
    expect((await write(`/api/v1/motors/${document.serial}/rework-notes`, { action: 'scrap', note: 'gone' }, operator).expect(422)).body.error.fields[0].field).toBe('action');
    expect(await server.db('rework_notes').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when quality holds a motor and releases it, then its status goes to on hold and back, with both in the audit trail', async () => {
    const document = await testMotor();
    const hold = await write(`/api/v1/motors/${document.serial}/holds`, { reason: 'Suspect magnet batch, check back-EMF' }).expect(201);
    expect(hold.body).toMatchObject({ target: { type: 'motor', serial: document.serial }, kind: 'manual', releasedAt: null });
    expect((await get(`/api/v1/motors/${document.serial}`)).body.status).toBe('on hold');
    const released = await write(`/api/v1/holds/${hold.body.id}/release`, { reason: 'Back-EMF re-checked within limits' }).expect(200);
    expect(released.body).toMatchObject({ releaseReason: 'Back-EMF re-checked within limits', releasedAt: expect.any(String) });
    const record = motorRecordSchema.parse((await get(`/api/v1/motors/${document.serial}`)).body);
    expect(record.status).toBe('passed');
    expect(record.holds).toHaveLength(1);
    expect(record.auditEvents.map((e) => [e.action, e.reason])).toEqual([
      ['hold.placed', 'Suspect magnet batch, check back-EMF'], ['hold.released', 'Back-EMF re-checked within limits'],
    ]);
  });
});
