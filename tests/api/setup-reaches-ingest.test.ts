import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { clientToken } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import type { RunningServer } from '../../server/index.js';
import { createPlant, createStation, runDocument, type PlantFixture } from '../factories.js';
import { setupApi, signedIn, type Agent } from './setup-fixtures.js';

// Ingest caches products, characteristics and the client's station for seconds; a Setup change in
// the same process must reach the very next run, not the one after the cache expires. Each test
// first posts a run so that the cache is warm with the old value.
describe('Setup changes reach the next ingest in the same process', () => {
  let server: RunningServer;
  let token: string;
  let plant: PlantFixture;
  let quality: Agent;
  let admin: Agent;
  const post = (body: object) => request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${token}`).send(body);

  beforeAll(async () => {
    server = await startApiServer();
    token = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
    [quality, admin] = await Promise.all([signedIn(server.url, 'quality'), signedIn(server.url, 'admin')]);
    await post(runDocument(plant)).expect(201);
  });

  it('when quality changes a characteristic\'s unit, then the next run in the old unit is refused and one in the new unit is stored', async () => {
    const current = await quality.get(`${setupApi}/products/${plant.product.code}/characteristics`).expect(200);
    const ke = current.body.characteristics.find((c: { code: string }) => c.code === 'bemf.ke');
    await quality.put(`${setupApi}/products/${plant.product.code}/characteristics/bemf.ke`, {
      name: ke.name, unit: 'V/1000rpm', testStep: ke.testStep, spcEnabled: ke.spcEnabled, subgroupMode: ke.subgroupMode,
      subgroupSize: ke.subgroupSize, sortOrder: ke.sortOrder, reason: 'Unit written as the stand software reports it',
    }).expect(200);
    const oldUnit = await post(runDocument(plant)).expect(422);
    expect(oldUnit.body.error.fields).toContainEqual({ field: 'results[4].unit', message: 'bemf.ke is measured in V/1000rpm, not V/krpm' });
    const document = runDocument(plant);
    document.results[4] = { ...document.results[4], unit: 'V/1000rpm' };
    await post(document).expect(201);
  });

  it('when admin moves the client to another station, then the next run of that station is taken and one of the old station refused', async () => {
    const other = await createStation(server.db, { clientId: null });
    await post(runDocument(plant)).expect(201); // the factory emptied the cache; warm it again
    await admin.post(`${setupApi}/station-clients`, { clientId: 'demo-station', stationCode: other.code, reason: 'Stand PC moved to the other cell' }).expect(200);
    await post(runDocument(plant, { station: other.code })).expect(201);
    const refused = await post(runDocument(plant)).expect(403);
    expect(refused.body.error.fields).toEqual([{ field: 'station', message: `must be ${other.code}, the station bound to this client` }]);
  });

  it('when admin moves a station\'s calibration due date into the past, then the next run on it holds its motor', async () => {
    await admin.put(`${setupApi}/stations/${plant.station.code}`, {
      name: 'End-of-line stand', line: plant.station.line, kind: 'eol-pmsm', active: true, calibrationDue: '2021-03-31',
      reason: 'Load cell drift found; stand out of calibration',
    }).expect(200);
    const document = runDocument(plant);
    await post(document).expect(201);
    expect(await server.db('test_runs').where({ run_uuid: document.runId }).first()).toMatchObject({ calibration_ok: 0, calibration_due: new Date('2021-03-31T00:00:00Z') });
    expect(await server.db('motors').where({ serial: document.serial }).first()).toMatchObject({ status: 'on hold' });
  });

  it('when admin records a calibration that has already run out, then the next run on that station holds its motor', async () => {
    await admin.post(`${setupApi}/stations/${plant.station.code}/calibrations`, {
      calibratedOn: '2020-01-10', due: '2020-07-10', certificate: 'CAL-2020-0031', reason: 'Certificate found in the archive',
    }).expect(201);
    const document = runDocument(plant);
    await post(document).expect(201);
    expect(await server.db('test_runs').where({ run_uuid: document.runId }).first()).toMatchObject({ calibration_ok: 0 });
    expect(await server.db('motors').where({ serial: document.serial }).first()).toMatchObject({ status: 'on hold' });
  });
});
