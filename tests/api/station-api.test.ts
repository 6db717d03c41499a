import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { clientToken } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import type { RunningServer } from '../../server/index.js';
import { testRunResponseSchema } from '../../server/schemas/test-run.js';
import { stationSchema, testPlanSchema, productListSchema } from '../../server/openapi/response-schemas.js';
import { createLimitSet, createPlant, runDocument, type PlantFixture } from '../factories.js';

describe('station API: plan, station and run ingest', () => {
  let server: RunningServer;
  let token: string;
  let plant: PlantFixture;
  const post = (body: object, bearer = token) => request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${bearer}`).send(body);

  beforeAll(async () => {
    server = await startApiServer();
    token = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
  });

  it('when a stand loads its plan, then it gets every characteristic with unit and the limits in force', async () => {
    const list = await request(server.url).get('/api/v1/products').set('authorization', `Bearer ${token}`).expect(200);
    expect(productListSchema.parse(list.body).items.map((p) => p.code)).toEqual([plant.product.code]);
    const response = await request(server.url).get(`/api/v1/products/${plant.product.code}/test-plan`).set('authorization', `Bearer ${token}`).expect(200);
    const body = testPlanSchema.parse(response.body);
    expect(body.limitRevision).toBe(1);
    expect(body.characteristics.map((c) => c.code)).toEqual(plant.product.characteristics.map((c) => c.code));
    expect(body.characteristics[0]).toMatchObject({ code: 'wr.u.r20', unit: 'mΩ', lsl: 20.5, nominal: 21, usl: 21.5 });
  });

  it('when a stand asks who it is, then it gets the station bound to its client', async () => {
    const response = await request(server.url).get('/api/v1/stations/me').set('authorization', `Bearer ${token}`).expect(200);
    expect(stationSchema.parse(response.body)).toMatchObject({ code: plant.station.code, line: 'L1', kind: 'eol-pmsm' });
  });

  it('when a client is bound to no station, then stations/me answers 404', async () => {
    const other = await clientToken(idpUrl, 'demo-station-b', 'demo-station-b-secret', { scope: 'test-runs:write' });
    const response = await request(server.url).get('/api/v1/stations/me').set('authorization', `Bearer ${other}`).expect(404);
    expect(response.body.error.message).toContain('demo-station-b');
  });

  it('when a valid run is posted, then it is stored, judged and answered with 201', async () => {
    const document = runDocument(plant);
    const response = await post(document).expect(201);
    const body = testRunResponseSchema.parse(response.body);
    expect(body).toMatchObject({ runId: document.runId, serial: document.serial, attempt: 1, verdict: 'pass', limitRevision: 1 });
    expect(body.results).toHaveLength(document.results.length);
    expect(body.results[0]).toEqual({ characteristic: 'wr.u.r20', value: 21.02, unit: 'mΩ', lsl: 20.5, usl: 21.5, verdict: 'pass' });
    const run = await server.db('test_runs').where({ run_uuid: document.runId }).first();
    expect(run).toMatchObject({ attempt: 1, verdict: 'pass', limit_set_id: plant.limitSet.id, calibration_ok: 1, station_id: plant.station.id });
    expect(await server.db('measurements').where({ run_id: run.id }).count({ n: '*' })).toEqual([{ n: document.results.length }]);
    expect(await server.db('motors').where({ serial: document.serial }).first()).toMatchObject({ status: 'passed', attempts: 1, latest_run_id: run.id });
  });

  it('when a value is outside its limits, then that result and the run fail and the motor is failed', async () => {
    const document = runDocument(plant);
    document.results[4] = { characteristic: 'bemf.ke', value: 52.01, unit: 'V/krpm' };
    const body = (await post(document).expect(201)).body;
    expect(body.verdict).toBe('fail');
    expect(body.results[4]).toMatchObject({ characteristic: 'bemf.ke', verdict: 'fail' });
    expect(body.results.filter((r: { verdict: string }) => r.verdict === 'fail')).toHaveLength(1);
    expect(await server.db('motors').where({ serial: document.serial }).first()).toMatchObject({ status: 'failed' });
  });

  it('when a value sits exactly on a limit, then it passes', async () => {
    const document = runDocument(plant);
    document.results[3] = { characteristic: 'hipot.leakage', value: 5, unit: 'mA' };
    expect((await post(document).expect(201)).body.verdict).toBe('pass');
  });

  it('when the same run is posted again with the same body, then the first answer comes back with 200 and nothing is duplicated', async () => {
    const document = runDocument(plant);
    const first = await post(document).expect(201);
    const reordered = Object.fromEntries(Object.entries(document).reverse());
    const again = await post(reordered).expect(200);
    expect(again.body).toEqual(first.body);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(await server.db('motors').where({ serial: document.serial }).first()).toMatchObject({ attempts: 1 });
  });

  it('when two identical posts race, then one run is stored and both get the same answer', async () => {
    const document = runDocument(plant);
    const [a, b] = await Promise.all([post(document), post(document)]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body).toEqual(b.body);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(await server.db('measurements').count({ n: '*' })).toEqual([{ n: document.results.length }]);
  });

  it('when a runId is reused with a different body, then it answers 409 and keeps the first run', async () => {
    const document = runDocument(plant);
    await post(document).expect(201);
    const changed = { ...document, results: [{ ...document.results[0], value: 21.3 }, ...document.results.slice(1)] };
    const response = await post(changed).expect(409);
    expect(response.body.error.fields).toEqual([{ field: 'runId', message: 'already used for a different run' }]);
    expect(await server.db('measurements').where({ characteristic_id: plant.product.characteristics[0].id }).first()).toMatchObject({ value: 21.02 });
  });

  it('when a serial is tested again, then the retest is attempt 2 and the status follows the latest run', async () => {
    const first = runDocument(plant);
    first.results[2] = { characteristic: 'ir.r40', value: 40, unit: 'MΩ' };
    expect((await post(first).expect(201)).body).toMatchObject({ attempt: 1, verdict: 'fail' });
    const retest = runDocument(plant, { serial: first.serial });
    expect((await post(retest).expect(201)).body).toMatchObject({ attempt: 2, verdict: 'pass' });
    expect(await server.db('motors').where({ serial: first.serial }).first()).toMatchObject({ status: 'passed', attempts: 2 });
  });

  it('when two different runs of one new serial race, then they become attempts 1 and 2', async () => {
    const a = runDocument(plant);
    const b = runDocument(plant, { serial: a.serial });
    const responses = await Promise.all([post(a), post(b)]);
    expect(responses.map((r) => r.status)).toEqual([201, 201]);
    expect(responses.map((r) => r.body.attempt).sort()).toEqual([1, 2]);
  });

  it('when two approved revisions exist, then each run is judged by the one in force at its startedAt', async () => {
    const revisionTwoFrom = new Date(Date.now() - 86_400_000);
    await createLimitSet(server.db, plant.product, { revision: 2, effectiveFrom: revisionTwoFrom, limits: { 'bemf.ke': { lsl: 49, nominal: 50, usl: 50.2 } } });
    const before = runDocument(plant, { startedAt: new Date(revisionTwoFrom.getTime() - 3_600_000).toISOString(), finishedAt: new Date(revisionTwoFrom.getTime() - 3_000_000).toISOString() });
    const after = runDocument(plant);
    const old = (await post(before).expect(201)).body;
    const current = (await post(after).expect(201)).body;
    expect(old).toMatchObject({ limitRevision: 1, verdict: 'pass' });
    expect(old.results[4]).toMatchObject({ lsl: 48, usl: 52, verdict: 'pass' });
    expect(current).toMatchObject({ limitRevision: 2, verdict: 'fail' });
    expect(current.results[4]).toMatchObject({ lsl: 49, usl: 50.2, verdict: 'fail' });
    // Revision 2 has limits only for bemf.ke: the other characteristics have none and pass.
    expect(current.results[0]).toMatchObject({ characteristic: 'wr.u.r20', lsl: null, usl: null, verdict: 'pass' });
  });

  it('when a draft revision is newer, then the approved one still judges', async () => {
    await createLimitSet(server.db, plant.product, { revision: 2, status: 'draft', effectiveFrom: new Date(Date.now() - 86_400_000), limits: { 'bemf.ke': { lsl: 0, usl: 1 } } });
    expect((await post(runDocument(plant)).expect(201)).body).toMatchObject({ limitRevision: 1, verdict: 'pass' });
  });

  it('when the station calibration had expired, then the run is stored, flagged and the motor held with that reason, audited', async () => {
    await server.db('stations').where({ id: plant.station.id }).update({ calibration_due: '2020-01-31' });
    const document = runDocument(plant);
    const body = (await post(document).expect(201)).body;
    expect(body.verdict).toBe('pass');
    const run = await server.db('test_runs').where({ run_uuid: document.runId }).first();
    expect(run.calibration_ok).toBe(0);
    const motor = await server.db('motors').where({ serial: document.serial }).first();
    expect(motor.status).toBe('on hold');
    const holds = await server.db('holds').where({ motor_id: motor.id });
    expect(holds).toHaveLength(1);
    expect(holds[0]).toMatchObject({ kind: 'calibration', released_at: null });
    expect(holds[0].reason).toContain('2020-01-31');
    const audit = await server.db('audit_events').where({ entity_type: 'motor', entity_id: document.serial });
    expect(audit.map((a) => a.action)).toEqual(['hold.placed']);
    expect(audit[0].reason).toBe(holds[0].reason);
  });

  it('when a held motor is retested on a stand still out of calibration, then the run is stored and the one calibration hold stays', async () => {
    await server.db('stations').where({ id: plant.station.id }).update({ calibration_due: '2020-01-31' });
    const first = runDocument(plant);
    await post(first).expect(201);
    const retest = runDocument(plant, { serial: first.serial });
    expect((await post(retest).expect(201)).body).toMatchObject({ attempt: 2, verdict: 'pass' });
    expect(await server.db('test_runs').where({ run_uuid: retest.runId }).first()).toMatchObject({ attempt: 2, calibration_ok: 0 });
    const motor = await server.db('motors').where({ serial: first.serial }).first();
    expect(motor.status).toBe('on hold');
    const holds = await server.db('holds').where({ motor_id: motor.id });
    expect(holds).toHaveLength(1);
    expect(holds[0]).toMatchObject({ kind: 'calibration', released_at: null });
    expect(await server.db('audit_events').where({ action: 'hold.placed' }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('when the calibration falls due on the day of the run, then the run is in calibration', async () => {
    const document = runDocument(plant);
    await server.db('stations').where({ id: plant.station.id }).update({ calibration_due: document.startedAt.slice(0, 10) });
    await post(document).expect(201);
    expect(await server.db('test_runs').where({ run_uuid: document.runId }).first()).toMatchObject({ calibration_ok: 1 });
    expect(await server.db('holds').count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
