import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/index.js';
import { startApiServer } from '../support/api-server.js';
import { seedPlant, signedIn } from './evidence-seed.js';

describe('GET /api/v1/trace/component-lots/:code', () => {
  let server: RunningServer;
  beforeAll(async () => {
    server = await startApiServer();
    await seedPlant(server.db);
  });
  afterAll(async () => { await server.stop(); });

  it('when a stator lot went into two Fluxtrail lots, then both lots and all their motors come back with status and hold', async () => {
    const operator = await signedIn(server.url, 'operator');
    const response = await operator.get('/api/v1/trace/component-lots/ST-77').expect(200);
    expect(response.body.lots).toEqual([
      { code: 'LOT-A', product: 'PM-150', componentKind: 'stator', supplier: 'Invented Supplier GmbH', motorCount: 4, onHold: false },
      { code: 'LOT-B', product: 'PM-150', componentKind: 'stator', supplier: 'Invented Supplier GmbH', motorCount: 2, onHold: true },
    ]);
    expect(response.body.motors.map((m: { serial: string; status: string; onHold: boolean }) => [m.serial, m.status, m.onHold])).toEqual([
      ['PM150-0001', 'passed', false], ['PM150-0002', 'passed', false], ['PM150-0003', 'passed', false],
      ['PM150-0004', 'passed', false], ['PM150-0005', 'on hold', true], ['PM150-0006', 'on hold', true],
    ]);
    expect(response.body.motorsTruncated).toBe(false);
  });

  it('when the component lot is unknown, then the answer is empty rather than an error', async () => {
    const auditor = await signedIn(server.url, 'auditor');
    const response = await auditor.get('/api/v1/trace/component-lots/NO-SUCH').expect(200);
    expect(response.body).toEqual({ componentLot: 'NO-SUCH', lots: [], motors: [], motorsTruncated: false });
  });

  it('when nobody is signed in, then 401', async () => {
    const response = await fetch(`${server.url}/api/v1/trace/component-lots/ST-77`);
    expect(response.status).toBe(401);
  });
});
