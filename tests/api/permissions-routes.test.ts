import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { clientToken, signIn } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { placeHold } from '../../server/services/holds/place-hold.js';
import { createPlant, runDocument, type PlantFixture } from '../factories.js';

type Role = 'operator' | 'quality' | 'auditor' | 'manager' | 'admin';
type Route = { name: string; method: 'get' | 'post'; path: () => string | Promise<string>; body?: () => object; allowed: readonly Role[] };

const everyone: readonly Role[] = ['operator', 'quality', 'auditor', 'manager', 'admin'];
let plant: PlantFixture;
let serial: string;
let server: RunningServer;

/**
 * A fresh active hold for each release attempt, so every role meets the same situation; on a
 * motor of its own, since a motor carries one active manual hold at a time.
 */
async function freshHoldId() {
  const document = runDocument(plant);
  await ingestTestRun(server.db, document);
  const hold = await placeHold(server.db, { target: { type: 'motor', serial: document.serial }, kind: 'manual', reason: 'Held for the permission table', actor: { name: 'test', role: null } });
  return `/api/v1/holds/${hold.id}/release`;
}

const routes: Route[] = [
  { name: 'list products', method: 'get', path: () => '/api/v1/products', allowed: everyone },
  { name: 'read a test plan', method: 'get', path: () => `/api/v1/products/${plant.product.code}/test-plan`, allowed: everyone },
  { name: 'list motors', method: 'get', path: () => '/api/v1/motors', allowed: everyone },
  { name: 'read a motor record', method: 'get', path: () => `/api/v1/motors/${serial}`, allowed: everyone },
  { name: 'list lots', method: 'get', path: () => '/api/v1/lots', allowed: everyone },
  { name: 'read a lot', method: 'get', path: () => `/api/v1/lots/${plant.lot.code}`, allowed: everyone },
  { name: 'record rework', method: 'post', path: () => `/api/v1/motors/${serial}/rework-notes`, body: () => ({ action: 'rework', note: 'Replaced connector' }), allowed: ['operator', 'quality'] },
  { name: 'request a retest', method: 'post', path: () => `/api/v1/motors/${serial}/rework-notes`, body: () => ({ action: 'retest', note: 'Retest after rework' }), allowed: ['operator', 'quality'] },
  { name: 'hold a motor', method: 'post', path: () => `/api/v1/motors/${serial}/holds`, body: () => ({ reason: 'Contain for review' }), allowed: ['quality'] },
  { name: 'hold a lot', method: 'post', path: () => `/api/v1/lots/${plant.lot.code}/holds`, body: () => ({ reason: 'Contain for review' }), allowed: ['quality'] },
  { name: 'release a hold', method: 'post', path: freshHoldId, body: () => ({ reason: 'Reviewed and cleared' }), allowed: ['quality'] },
  { name: 'post a test run', method: 'post', path: () => '/api/v1/test-runs', body: () => runDocument(plant), allowed: [] },
  { name: 'ask which station it is', method: 'get', path: () => '/api/v1/stations/me', allowed: [] },
];

const table = routes.flatMap((route) => everyone.map((role) => ({ ...route, role, expected: route.allowed.includes(role) ? 'permitted' : 'forbidden' })));

describe('who may call the station and record routes', () => {
  const cookies = new Map<Role, string>();
  const call = async (route: Route, auth: (r: request.Test) => request.Test) => {
    const path = await route.path();
    const test = auth(route.method === 'get' ? request(server.url).get(path) : request(server.url).post(path).set('x-fluxtrail-csrf', '1'));
    return route.body ? test.send(route.body()) : test;
  };

  beforeAll(async () => {
    server = await startApiServer();
    plant = await createPlant(server.db);
    const document = runDocument(plant);
    await ingestTestRun(server.db, document);
    serial = document.serial;
    for (const role of everyone) cookies.set(role, (await signIn(server.url, role)).cookie);
  });
  afterAll(async () => { await server.stop(); });

  it.each(table)('when $role tries to $name, then it is $expected', async ({ role, expected, ...route }) => {
    const response = await call(route, (r) => r.set('cookie', cookies.get(role) ?? ''));
    if (expected === 'permitted') expect(response.status, JSON.stringify(response.body)).toBeLessThan(300);
    else expect(response.status).toBe(403);
  });

  it.each(routes)('when nobody is signed in and there is no token, then $name answers 401', async (route) => {
    expect((await call(route, (r) => r)).status).toBe(401);
  });

  describe('bearer tokens', () => {
    const stationAllowed = new Set(['list products', 'read a test plan', 'post a test run', 'ask which station it is']);
    const readerAllowed = new Set(['list products', 'read a test plan', 'list motors', 'read a motor record', 'list lots', 'read a lot']);

    it.each(routes)('when a station token (test-runs:write) tries to $name, then only plan, station and run routes accept it', async (route) => {
      const token = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
      const response = await call(route, (r) => r.set('authorization', `Bearer ${token}`));
      if (stationAllowed.has(route.name)) expect(response.status, JSON.stringify(response.body)).toBeLessThan(300);
      else expect(response.status).toBe(403);
    });

    it.each(routes)('when an integration token (records:read) tries to $name, then only the read routes accept it', async (route) => {
      const token = await clientToken(idpUrl, 'demo-integration', 'demo-integration-secret', { scope: 'records:read' });
      const response = await call(route, (r) => r.set('authorization', `Bearer ${token}`));
      if (readerAllowed.has(route.name)) expect(response.status, JSON.stringify(response.body)).toBeLessThan(300);
      else expect(response.status).toBe(403);
    });

    it('when the integration client posts a run, then it is refused for the missing scope and nothing is stored', async () => {
      const token = await clientToken(idpUrl, 'demo-integration', 'demo-integration-secret', { scope: 'records:read' });
      const document = runDocument(plant);
      const response = await request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${token}`).send(document).expect(403);
      expect(response.body.error.code).toBe('insufficient_scope');
      expect(await server.db('test_runs').where({ run_uuid: document.runId }).first()).toBeUndefined();
    });

    it('when a token was issued for another audience, then it is refused with 401', async () => {
      const token = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write', resource: 'urn:other:api' });
      const response = await request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${token}`).send(runDocument(plant)).expect(401);
      expect(response.body.error.code).toBe('invalid_token');
    });

    it('when a token has expired, then it is refused with 401 token_expired', async () => {
      const token = await clientToken(idpUrl, 'short-lived-station', 'short-lived-station-secret', { scope: 'test-runs:write' });
      await new Promise((resolve) => setTimeout(resolve, 1500));
      const response = await request(server.url).get('/api/v1/products').set('authorization', `Bearer ${token}`).expect(401);
      expect(response.body.error.code).toBe('token_expired');
    });
  });
});
