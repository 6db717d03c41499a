import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/index.js';
import { startApiServer } from '../support/api-server.js';
import { auditOf, parsed, setupApi, signedIn, type Agent } from './setup-fixtures.js';

const day = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);
const demoStation = (code: string, calibrationDue: string) => ({
  code, name: `End-of-line stand ${code}`, line: 'L2', kind: 'eol-pmsm', active: true, calibrationDue,
});

describe('Setup API: stations, calibration and station clients', () => {
  let server: RunningServer;
  let admin: Agent;
  beforeAll(async () => {
    server = await startApiServer();
    admin = await signedIn(server.url, 'admin');
  });
  afterAll(async () => { await server.stop(); });

  it('when admin records a calibration, then the history shows it, the due date moves and it is audited', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-21', day(-3))).expect(201);
    const recorded = await admin.post(`${setupApi}/stations/EOL-21/calibrations`, {
      calibratedOn: day(0), due: day(365), certificate: 'CAL-2026-0417', reason: 'annual',
    });
    expect(recorded.status).toBe(201);
    expect(recorded.body.station).toMatchObject({ code: 'EOL-21', calibrationDue: day(365), calibrationState: 'valid' });

    const history = await admin.get(`${setupApi}/stations/EOL-21/calibrations`).expect(200);
    expect(history.body.calibrations).toHaveLength(1);
    expect(history.body.calibrations[0]).toMatchObject({ calibratedOn: day(0), due: day(365), certificate: 'CAL-2026-0417', recordedBy: 'Jonas Weber' });

    const audit = await auditOf(server.db, 'station', 'EOL-21');
    expect(audit.map((e) => e.action)).toEqual(['station.created', 'station.calibration_recorded']);
    expect(parsed(audit[1].before_json)).toMatchObject({ calibrationDue: day(-3), calibrationState: 'expired' });
    expect(parsed(audit[1].after_json)).toMatchObject({ calibrationDue: day(365) });
  });

  it('when admin edits a station and moves its due date with a reason, then it is saved and audited and the calibration history stays as it was', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-71', day(200))).expect(201);
    await admin.post(`${setupApi}/stations/EOL-71/calibrations`, { calibratedOn: day(-10), due: day(355), certificate: 'CAL-2026-0555' }).expect(201);
    const historyBefore = (await admin.get(`${setupApi}/stations/EOL-71/calibrations`).expect(200)).body.calibrations;
    const edited = await admin.put(`${setupApi}/stations/EOL-71`, {
      name: 'Pack-out stand 71', line: 'L3', kind: 'eol-dc', active: true, calibrationDue: day(-1),
      reason: 'Reference shunt found damaged; stand out of calibration until re-certified',
    }).expect(200);
    expect(edited.body.station).toEqual({
      code: 'EOL-71', name: 'Pack-out stand 71', line: 'L3', kind: 'eol-dc', active: true, calibrationDue: day(-1), calibrationState: 'expired',
    });
    expect((await admin.get(`${setupApi}/stations/EOL-71/calibrations`).expect(200)).body.calibrations).toEqual(historyBefore);
    const audit = await auditOf(server.db, 'station', 'EOL-71');
    expect(audit.map((e) => e.action)).toEqual(['station.created', 'station.calibration_recorded', 'station.updated']);
    expect(parsed(audit[2].before_json)).toMatchObject({ name: 'End-of-line stand EOL-71', line: 'L2', calibrationDue: day(355), calibrationState: 'valid' });
    expect(parsed(audit[2].after_json)).toMatchObject({ name: 'Pack-out stand 71', line: 'L3', calibrationDue: day(-1), calibrationState: 'expired' });
    expect(audit[2].reason).toBe('Reference shunt found damaged; stand out of calibration until re-certified');
  });

  it('when the due date moves without a reason, then 422 names reason and nothing changes; other edits need none', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-72', day(90))).expect(201);
    const moved = await admin.put(`${setupApi}/stations/EOL-72`, { ...demoStation('EOL-72', day(400)), code: undefined, reason: ' ' }).expect(422);
    expect(moved.body.error.fields).toEqual([{ field: 'reason', message: 'Say why the calibration due date moves without a recorded calibration' }]);
    const stored = await server.db('stations').where({ code: 'EOL-72' }).first();
    expect(stored.calibration_due.toISOString().slice(0, 10)).toBe(day(90));
    const renamed = await admin.put(`${setupApi}/stations/EOL-72`, { ...demoStation('EOL-72', day(90)), code: undefined, name: 'Stand 72' }).expect(200);
    expect(renamed.body.station).toMatchObject({ name: 'Stand 72', calibrationDue: day(90) });
    const missing = await admin.put(`${setupApi}/stations/EOL-72`, { name: 'Stand 72', line: 'L2', kind: 'eol-pmsm', active: true }).expect(422);
    expect(missing.body.error.fields).toContainEqual(expect.objectContaining({ field: 'calibrationDue' }));
  });

  it('when stations are listed, then an expired and a soon-due calibration are told apart from a valid one', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-31', day(-1))).expect(201);
    await admin.post(`${setupApi}/stations`, demoStation('EOL-32', day(5))).expect(201);
    await admin.post(`${setupApi}/stations`, demoStation('EOL-33', day(90))).expect(201);
    const list = await admin.get(`${setupApi}/stations`).expect(200);
    const states = Object.fromEntries(list.body.stations.map((s: { code: string; calibrationState: string }) => [s.code, s.calibrationState]));
    expect(states).toMatchObject({ 'EOL-31': 'expired', 'EOL-32': 'due-soon', 'EOL-33': 'valid' });
  });

  it('when the due date is not after the calibration date, then 422 names due and the station keeps its date', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-41', day(30))).expect(201);
    const response = await admin.post(`${setupApi}/stations/EOL-41/calibrations`, { calibratedOn: day(0), due: day(0), certificate: null });
    expect(response.status).toBe(422);
    expect(response.body.error.fields).toContainEqual(expect.objectContaining({ field: 'due' }));
    const station = await server.db('stations').where({ code: 'EOL-41' }).first();
    expect(await server.db('station_calibrations').where({ station_id: station.id })).toEqual([]);
    expect(station.calibration_due.toISOString().slice(0, 10)).toBe(day(30));
  });

  it('when admin binds a client id and later moves it, then the binding follows and both are audited', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-51', day(60))).expect(201);
    await admin.post(`${setupApi}/stations`, demoStation('EOL-52', day(60))).expect(201);
    await admin.post(`${setupApi}/station-clients`, { clientId: 'demo-station', stationCode: 'EOL-51' }).expect(200);
    await admin.post(`${setupApi}/station-clients`, { clientId: 'demo-station', stationCode: 'EOL-52', reason: 'stand swapped' }).expect(200);
    const list = await admin.get(`${setupApi}/station-clients`).expect(200);
    expect(list.body.stationClients).toEqual([{ clientId: 'demo-station', stationCode: 'EOL-52' }]);
    const audit = await auditOf(server.db, 'station_client', 'demo-station');
    expect(audit.map((e) => e.action)).toEqual(['station_client.bound', 'station_client.bound']);
    expect(parsed(audit[1].before_json)).toEqual({ clientId: 'demo-station', stationCode: 'EOL-51' });
    const unknown = await admin.post(`${setupApi}/station-clients`, { clientId: 'demo-station-b', stationCode: 'NOPE' });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields).toContainEqual(expect.objectContaining({ field: 'stationCode' }));
  });

  it('when quality, operator, manager or auditor write stations, then each gets 403', async () => {
    await admin.post(`${setupApi}/stations`, demoStation('EOL-61', day(60))).expect(201);
    for (const login of ['quality', 'operator', 'manager', 'auditor']) {
      const agent = await signedIn(server.url, login);
      expect((await agent.post(`${setupApi}/stations`, demoStation('EOL-62', day(60)))).status, login).toBe(403);
      expect((await agent.put(`${setupApi}/stations/EOL-61`, { ...demoStation('EOL-61', day(-5)), code: undefined, reason: 'no' })).status, login).toBe(403);
      expect((await agent.post(`${setupApi}/stations/EOL-61/calibrations`, { calibratedOn: day(0), due: day(30), certificate: null })).status, login).toBe(403);
      expect((await agent.post(`${setupApi}/station-clients`, { clientId: 'demo-station-b', stationCode: 'EOL-61' })).status, login).toBe(403);
    }
    expect(await server.db('stations').where({ code: 'EOL-62' }).first()).toBeUndefined();
    expect((await server.db('stations').where({ code: 'EOL-61' }).first()).calibration_due.toISOString().slice(0, 10)).toBe(day(60));
    expect(await server.db('station_calibrations').where({ station_id: (await server.db('stations').where({ code: 'EOL-61' }).first()).id })).toEqual([]);
  });
});
