import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { clientToken } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import type { RunningServer } from '../../server/index.js';
import type { TestRunDocument } from '../../server/schemas/test-run.js';
import { createLot, createPlant, createProduct, createLimitSet, createStation, runDocument, type PlantFixture } from '../factories.js';

type Case = { name: string; status: number; field: string; mutate: (doc: TestRunDocument, plant: PlantFixture) => unknown };

const inMs = (ms: number) => new Date(Date.now() + ms).toISOString();

// Each case starts from a valid document, breaks one thing, and names the field the answer must blame.
const cases: Case[] = [
  { name: 'the product is unknown', status: 422, field: 'product', mutate: (d) => ({ ...d, product: 'NO-SUCH' }) },
  { name: 'the station is not the one bound to the token', status: 403, field: 'station', mutate: (d) => ({ ...d, station: 'EOL-ELSEWHERE' }) },
  { name: 'a characteristic is unknown', status: 422, field: 'results[2].characteristic', mutate: (d) => { d.results[2].characteristic = 'bemf.flux'; return d; } },
  { name: 'a unit differs from the characteristic unit', status: 422, field: 'results[1].unit', mutate: (d) => { d.results[1].unit = 'ppm'; return d; } },
  { name: 'a value is a string', status: 422, field: 'results[3].value', mutate: (d) => ({ ...d, results: d.results.map((r, i) => (i === 3 ? { ...r, value: '1.2' } : r)) }) },
  { name: 'a value is null', status: 422, field: 'results[3].value', mutate: (d) => ({ ...d, results: d.results.map((r, i) => (i === 3 ? { ...r, value: null } : r)) }) },
  { name: 'the serial does not fit the product pattern', status: 422, field: 'serial', mutate: (d) => ({ ...d, serial: 'XX12' }) },
  { name: 'finishedAt is before startedAt', status: 422, field: 'finishedAt', mutate: (d) => ({ ...d, finishedAt: new Date(Date.parse(d.startedAt) - 1000).toISOString() }) },
  { name: 'startedAt is more than 2 minutes in the future', status: 422, field: 'startedAt', mutate: (d) => ({ ...d, startedAt: inMs(180_000), finishedAt: inMs(190_000) }) },
  { name: 'startedAt has no offset', status: 422, field: 'startedAt', mutate: (d) => ({ ...d, startedAt: d.startedAt.replace('Z', '') }) },
  { name: 'a characteristic is reported twice', status: 422, field: 'results[5].characteristic', mutate: (d) => { d.results[5] = { ...d.results[0] }; return d; } },
  { name: 'the lot is unknown', status: 422, field: 'lot', mutate: (d) => ({ ...d, lot: 'LOT-NOWHERE' }) },
  { name: 'the runId is not a UUID', status: 422, field: 'runId', mutate: (d) => ({ ...d, runId: 'run-17' }) },
  { name: 'the operator badge is missing', status: 422, field: 'operatorBadge', mutate: ({ operatorBadge: _badge, ...d }) => d },
  { name: 'the results are empty', status: 422, field: 'results', mutate: (d) => ({ ...d, results: [] }) },
  { name: 'no approved revision was in force at startedAt', status: 422, field: 'startedAt', mutate: (d) => ({ ...d, startedAt: '2019-03-01T06:00:00+01:00', finishedAt: '2019-03-01T06:04:00+01:00' }) },
];

describe('station API: refused runs store nothing', () => {
  let server: RunningServer;
  let token: string;
  let plant: PlantFixture;
  const post = (body: unknown) => request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${token}`).set('content-type', 'application/json')
    .send(typeof body === 'string' ? body : JSON.stringify(body));
  const stored = async () => ({
    runs: (await server.db('test_runs').count({ n: '*' }))[0].n, measurements: (await server.db('measurements').count({ n: '*' }))[0].n,
    motors: (await server.db('motors').count({ n: '*' }))[0].n, holds: (await server.db('holds').count({ n: '*' }))[0].n,
  });
  const nothing = { runs: 0, measurements: 0, motors: 0, holds: 0 };

  beforeAll(async () => {
    server = await startApiServer();
    token = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
  });

  it.each(cases)('when $name, then it answers $status naming $field and stores nothing', async ({ status, field, mutate }) => {
    const response = await post(mutate(runDocument(plant), plant));
    expect(response.status).toBe(status);
    expect(response.body.error.fields.map((f: { field: string }) => f.field)).toContain(field);
    expect(await stored()).toEqual(nothing);
  });

  it('when a value is not finite (1e400 parses to Infinity), then results[0].value is refused', async () => {
    const text = JSON.stringify(runDocument(plant)).replace('"value":21.02', '"value":1e400');
    const response = await post(text);
    expect(response.status).toBe(422);
    expect(response.body.error.fields.map((f: { field: string }) => f.field)).toContain('results[0].value');
    expect(await stored()).toEqual(nothing);
  });

  it('when startedAt is one minute ahead of the server clock, then it is accepted as clock skew', async () => {
    await post(runDocument(plant, { startedAt: inMs(60_000), finishedAt: inMs(90_000) })).expect(201);
  });

  it('when the document carries an unknown field, then it is refused by name instead of dropped', async () => {
    const response = await post({ ...runDocument(plant), temperatureC: 23 });
    expect(response.status).toBe(422);
    expect(response.body.error.fields[0].message).toContain('temperatureC');
  });

  it('when the lot belongs to another product, then lot is refused', async () => {
    const otherProduct = await createProduct(server.db, { serialPrefix: 'QV' });
    const foreignLot = await createLot(server.db, otherProduct);
    const response = await post(runDocument(plant, { lot: foreignLot.code })).expect(422);
    expect(response.body.error.fields).toEqual([{ field: 'lot', message: expect.stringContaining('another product') }]);
    expect(await stored()).toEqual(nothing);
  });

  it('when a serial was already built as another product, then serial is refused and only the first run exists', async () => {
    const other = await createProduct(server.db, { serialPrefix: 'FT' });
    await createLimitSet(server.db, other);
    const otherLot = await createLot(server.db, other);
    const first = runDocument(plant);
    await post(first).expect(201);
    const before = await stored();
    const response = await post(runDocument(plant, { serial: first.serial, product: other.code, lot: otherLot.code })).expect(422);
    expect(response.body.error.fields).toEqual([{ field: 'serial', message: expect.stringContaining('another product') }]);
    expect(await stored()).toEqual(before);
  });

  it('when a known serial is posted with another lot of its product, then lot is refused', async () => {
    const secondLot = await createLot(server.db, plant.product);
    const first = runDocument(plant);
    await post(first).expect(201);
    const before = await stored();
    const response = await post(runDocument(plant, { serial: first.serial, lot: secondLot.code })).expect(422);
    expect(response.body.error.fields[0].field).toBe('lot');
    expect(await stored()).toEqual(before);
  });

  it('when the token belongs to another station client, then a run for this station is refused on station', async () => {
    await createStation(server.db, { clientId: 'demo-station-b' });
    const otherToken = await clientToken(idpUrl, 'demo-station-b', 'demo-station-b-secret', { scope: 'test-runs:write' });
    const response = await request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${otherToken}`).send(runDocument(plant)).expect(403);
    expect(response.body.error).toMatchObject({ code: 'station_mismatch', fields: [{ field: 'station' }] });
    expect(await stored()).toEqual(nothing);
  });

  it('when the database refuses a measurement after the run row is written, then the whole run is rolled back', async () => {
    // A real constraint failure mid-transaction: a trigger refuses one characteristic's measurement,
    // which ingest inserts after the motor and the run rows.
    const refused = plant.product.characteristics[6].id;
    await server.db.raw('DROP TRIGGER IF EXISTS measurements_refuse_for_test');
    await server.db.raw(`CREATE TRIGGER measurements_refuse_for_test BEFORE INSERT ON measurements FOR EACH ROW
      BEGIN IF NEW.characteristic_id = ${Number(refused)} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused by test trigger'; END IF; END`);
    try {
      const response = await post(runDocument(plant));
      expect(response.status).toBe(500);
      expect(response.body.error.code).toBe('internal_error');
      expect(await stored()).toEqual(nothing);
      expect(await server.db('audit_events').count({ n: '*' })).toEqual([{ n: 0 }]);
    } finally {
      await server.db.raw('DROP TRIGGER IF EXISTS measurements_refuse_for_test');
    }
  });
});
