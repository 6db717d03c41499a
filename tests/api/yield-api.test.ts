import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { RunningServer } from '../../server/index.js';
import { getYieldHeadline } from '../../server/services/yield/get-yield-headline.js';
import { addDays, isoWeekOf } from '../../server/services/yield/plant-time.js';
import { rebuildYieldRollups } from '../../server/services/yield/update-yield-rollups.js';
import { placeHold } from '../../server/services/holds/place-hold.js';
import { startApiServer } from '../support/api-server.js';
import { clientToken } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import { signedIn, type Agent } from './setup-fixtures.js';
import type { Knex } from 'knex';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { createLimitSet, createLot, createProduct, createStation, runDocument, type PlantFixture } from '../factories.js';

// The crafted lot of the yield tests: ten motors first tested on one production day, three days ago
// (UTC, the default plant time), across two stations on two lines and all three default shifts.
//   7 pass first time (4 early on station A/L1, 3 late on station B/L2)
//   2 fail bemf.ke, then pass on retest (night, station A; retested the next morning on B)
//   1 fails bemf.ke and hipot.leakage, then fails its retest (02:00 the next day: still the night
//     shift of the first day, which began at 22:00)
// → first-pass yield 7/10 = 70 %, final yield 9/10 = 90 %; Pareto bemf.ke 3 (75 %), hipot.leakage 1 (25 %).
type CraftedLot = {
  day: string; nextDay: string; product: string; lot: string; stationA: string; stationB: string;
  retestedSerials: string[]; failedTwiceSerial: string;
};

const failing = (plant: PlantFixture, codes: string[]) =>
  plant.product.characteristics.filter((c) => !c.derived).map((c) => ({
    characteristic: c.code, unit: c.unit,
    value: codes.includes(c.code) ? (c.code === 'bemf.ke' ? 55 : 6.5) : c.demoValue,
  }));

async function ingestCraftedLot(db: Knex): Promise<CraftedLot> {
  const day = new Date(Date.now() - 3 * 86_400_000).toISOString().slice(0, 10);
  const nextDay = addDays(day, 1);
  const product = await createProduct(db);
  const limitSet = await createLimitSet(db, product);
  const a = await createStation(db, { line: 'L1', clientId: null });
  const b = await createStation(db, { line: 'L2', clientId: null });
  const lot = await createLot(db, product);
  const onA: PlantFixture = { product, limitSet, station: a, lot };
  const onB: PlantFixture = { product, limitSet, station: b, lot };

  const run = async (plant: PlantFixture, serial: string | undefined, startedAt: string, failCodes: string[] = []) => {
    const finishedAt = new Date(Date.parse(startedAt) + 4 * 60_000).toISOString();
    const document = runDocument(plant, { startedAt, finishedAt, results: failing(plant, failCodes), ...(serial ? { serial } : {}) });
    await ingestTestRun(db, document);
    return document.serial;
  };
  for (let i = 0; i < 4; i++) await run(onA, undefined, `${day}T08:${10 + i}:00.000Z`);
  for (let i = 0; i < 3; i++) await run(onB, undefined, `${day}T15:${10 + i}:00.000Z`);
  const retestedSerials: string[] = [];
  for (let i = 0; i < 2; i++) {
    const serial = await run(onA, undefined, `${day}T23:${30 + i}:00.000Z`, ['bemf.ke']);
    await run(onB, serial, `${nextDay}T07:${10 + i}:00.000Z`);
    retestedSerials.push(serial);
  }
  const failedTwiceSerial = await run(onB, undefined, `${nextDay}T02:00:00.000Z`, ['bemf.ke', 'hipot.leakage']);
  await run(onB, failedTwiceSerial, `${nextDay}T03:00:00.000Z`, ['bemf.ke']);
  return { day, nextDay, product: product.code, lot: lot.code, stationA: a.code, stationB: b.code, retestedSerials, failedTwiceSerial };
}

type Group = { key: string; tested: number; passedFirst: number; passedFinal: number; firstPassYield: number; finalYield: number };
const byKey = (groups: Group[]) => Object.fromEntries(groups.map((g) => [g.key, [g.tested, g.passedFirst, g.passedFinal]]));

describe('Yield API on a crafted lot (7 pass first, 2 pass on retest, 1 fails twice)', () => {
  let server: RunningServer;
  let manager: Agent;
  let crafted: CraftedLot;
  const range = () => `from=${crafted.day}&to=${crafted.nextDay}`;

  beforeAll(async () => {
    server = await startApiServer();
    manager = await signedIn(server.url, 'manager');
    crafted = await ingestCraftedLot(server.db);
  });
  afterAll(async () => { await server.stop(); });

  it('when grouped by day, then first-pass yield is 70 % and final yield 90 %, counted on the day of the first run', async () => {
    const response = await manager.get(`/api/v1/yield?${range()}&groupBy=day`).expect(200);
    expect(response.body.groups).toEqual([{ key: crafted.day, tested: 10, passedFirst: 7, passedFinal: 9, firstPassYield: 0.7, finalYield: 0.9 }]);
  });

  it('when grouped by week, product or lot, then the one group holds all ten motors', async () => {
    const keys = { week: isoWeekOf(crafted.day), product: crafted.product, lot: crafted.lot };
    for (const [groupBy, key] of Object.entries(keys)) {
      const response = await manager.get(`/api/v1/yield?${range()}&groupBy=${groupBy}`).expect(200);
      expect(response.body.groups, groupBy).toEqual([{ key, tested: 10, passedFirst: 7, passedFinal: 9, firstPassYield: 0.7, finalYield: 0.9 }]);
    }
  });

  it('when grouped by shift, then the 02:00 run belongs to the night shift that began the day before', async () => {
    const response = await manager.get(`/api/v1/yield?${range()}&groupBy=shift`).expect(200);
    expect(byKey(response.body.groups)).toEqual({
      [`${crafted.day}/early`]: [4, 4, 4], [`${crafted.day}/late`]: [3, 3, 3], [`${crafted.day}/night`]: [3, 0, 2],
    });
  });

  it('when grouped by line or station, then each motor counts where it was first tested, not where it was retested', async () => {
    const lines = await manager.get(`/api/v1/yield?${range()}&groupBy=line`).expect(200);
    expect(byKey(lines.body.groups)).toEqual({ L1: [6, 4, 6], L2: [4, 3, 3] });
    const l1 = lines.body.groups.find((g: Group) => g.key === 'L1');
    expect(l1.firstPassYield).toBeCloseTo(4 / 6, 12);
    expect(l1.finalYield).toBe(1);
    const stations = await manager.get(`/api/v1/yield?${range()}&groupBy=station`).expect(200);
    expect(byKey(stations.body.groups)).toEqual({ [crafted.stationA]: [6, 4, 6], [crafted.stationB]: [4, 3, 3] });
  });

  it('when the Pareto is read, then only first-attempt failures count, with their shares of all of them', async () => {
    const response = await manager.get(`/api/v1/yield?${range()}`).expect(200);
    expect(response.body.pareto).toEqual([
      { characteristic: 'bemf.ke', name: 'bemf.ke', failures: 3, share: 0.75 },
      { characteristic: 'hipot.leakage', name: 'hipot.leakage', failures: 1, share: 0.25 },
    ]);
  });

  it('when filtered by line, then groups and Pareto cover only the motors first tested there', async () => {
    const response = await manager.get(`/api/v1/yield?${range()}&groupBy=day&line=L2`).expect(200);
    expect(byKey(response.body.groups)).toEqual({ [crafted.day]: [4, 3, 3] });
    expect(response.body.pareto.map((p: { characteristic: string; failures: number }) => [p.characteristic, p.failures]))
      .toEqual([['bemf.ke', 1], ['hipot.leakage', 1]]);
  });

  it('when a Pareto bar or a shift is drilled into, then the motors behind it are listed', async () => {
    const hipot = await manager.get(`/api/v1/yield/motors?${range()}&characteristic=hipot.leakage`).expect(200);
    expect(hipot.body.total).toBe(1);
    expect(hipot.body.motors[0]).toMatchObject({ serial: crafted.failedTwiceSerial, firstVerdict: 'fail', finalVerdict: 'fail', attempts: 2, status: 'failed' });
    const bemf = await manager.get(`/api/v1/yield/motors?${range()}&characteristic=bemf.ke`).expect(200);
    expect(bemf.body.motors.map((m: { serial: string }) => m.serial).sort()).toEqual([...crafted.retestedSerials, crafted.failedTwiceSerial].sort());
    const night = await manager.get(`/api/v1/yield/motors?${range()}&groupBy=shift&key=${crafted.day}/night`).expect(200);
    expect(night.body.total).toBe(3);
    const line = await manager.get(`/api/v1/yield/motors?${range()}&groupBy=line&key=L1&outcome=failed-first`).expect(200);
    expect(line.body.motors.map((m: { serial: string }) => m.serial).sort()).toEqual([...crafted.retestedSerials].sort());
  });

  it('when the rollups are rebuilt from the record tables, then the answer is the same as the one kept by ingest', async () => {
    const kept = await manager.get(`/api/v1/yield?${range()}&groupBy=station`).expect(200);
    await rebuildYieldRollups(server.db);
    const rebuilt = await manager.get(`/api/v1/yield?${range()}&groupBy=station`).expect(200);
    expect(rebuilt.body).toEqual(kept.body);
  });

  it('when the headline is read on the crafted day, then it shows the day, the week and the motors on hold', async () => {
    await placeHold(server.db, { target: { type: 'motor', serial: crafted.failedTwiceSerial }, kind: 'manual', reason: 'hipot leakage above limit twice', actor: { name: 'Test Quality', role: 'quality' } });
    const headline = await getYieldHeadline(server.db, {}, new Date(`${crafted.day}T20:00:00Z`));
    expect(headline.today).toMatchObject({ key: crafted.day, tested: 10, passedFirst: 7, passedFinal: 9, firstPassYield: 0.7, finalYield: 0.9 });
    expect(headline.week.tested).toBe(10);
    expect(headline).toMatchObject({ motorsOnHold: 1, openSignals: 0, firstPassTarget: 0.95, timeZone: 'UTC' });
  });

  it('when dates, groupBy or a code are wrong, then 422 names the field', async () => {
    const cases: Array<[string, string]> = [
      ['from=2026-13-01', 'from'], ['to=yesterday', 'to'], ['groupBy=month', 'groupBy'],
      [`from=${crafted.nextDay}&to=${crafted.day}`, 'from'], ['product=NO-SUCH', 'product'], ['colour=red', '(body)'],
    ];
    for (const [query, field] of cases) {
      const response = await manager.get(`/api/v1/yield?${query}`);
      expect(response.status, query).toBe(422);
      expect(response.body.error.fields.map((f: { field: string }) => f.field), query).toContain(field);
    }
    const drill = await manager.get(`/api/v1/yield/motors?groupBy=day&key=last-week`);
    expect(drill.status).toBe(422);
    expect(drill.body.error.fields[0].field).toBe('key');
  });

  it('when callers differ, then manager and a records:read client may read, an operator and a station client may not', async () => {
    const reader = await clientToken(idpUrl, 'demo-integration', 'demo-integration-secret', { scope: 'records:read' });
    const asClient = await request(server.url).get(`/api/v1/yield?${range()}`).set('authorization', `Bearer ${reader}`);
    expect(asClient.status).toBe(200);
    expect(asClient.body.groups[0].tested).toBe(10);
    const station = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
    expect((await request(server.url).get('/api/v1/yield').set('authorization', `Bearer ${station}`)).status).toBe(403);
    const operator = await signedIn(server.url, 'operator');
    expect((await operator.get('/api/v1/yield').expect(403)).body.error.code).toBe('forbidden');
    expect((await operator.get('/api/v1/yield/motors')).status).toBe(403);
    expect((await request(server.url).get('/api/v1/yield')).status).toBe(401);
  });
});
