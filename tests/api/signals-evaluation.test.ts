import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { createLot, createPlant, runDocument, type PlantFixture } from '../factories.js';

// bemf.ke alternates 49.9 / 50.1 in the baseline: centre 50, MR̄ 0.2, σ̂ = 0.2/d₂(2) ≈ 0.177,
// so 3σ ≈ 0.53 and a value of 51 breaks Nelson 1 while 50.05 is well inside every rule.
const baseline = Array.from({ length: 100 }, (_, i) => (i % 2 === 0 ? 49.9 : 50.1));
const inControl = [50.05, 49.95, 50.05, 49.95];

describe('signals opened on ingest, containment and closing', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let quality: string;
  let operator: string;
  let manager: string;
  const ke = () => plant.product.characteristics.find((c) => c.code === 'bemf.ke')!.id;
  const post = (path: string, cookie: string, body: object = {}) =>
    request(server.url).post(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body);

  function document(value: number, lot = plant.lot.code) {
    const doc = runDocument(plant, { lot });
    doc.results = doc.results.map((r) => (r.characteristic === 'bemf.ke' ? { ...r, value } : r));
    return doc;
  }
  async function ingest(values: number[], lot = plant.lot.code): Promise<string[]> {
    const serials = [];
    for (const value of values) serials.push((await ingestTestRun(server.db, document(value, lot))).body.serial);
    return serials;
  }
  async function freezeBaseline() {
    await ingest(baseline);
    const trial = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    await post(`/api/v1/spc/control-limits/${trial.body.id}/freeze`, quality).expect(200);
  }
  const signals = () => server.db('signals').orderBy('id').select('id', 'rule', 'status', 'first_run_id');

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
    [quality, operator, manager] = (await Promise.all(['quality', 'operator', 'manager'].map((login) => signIn(server.url, login)))).map((s) => s.cookie);
  });

  it('when limits are only trial, then no run opens a signal', async () => {
    await ingest(baseline);
    await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    await ingest([55]);
    expect(await signals()).toEqual([]);
  });

  it('when two ingests that break one rule run at once, then exactly one signal opens for the episode', async () => {
    await freezeBaseline();
    // One far above and one far below: both break Nelson 1 and nothing else (Nelson 5 needs one side).
    await Promise.all([ingestTestRun(server.db, document(51)), ingestTestRun(server.db, document(49))]);
    const opened = await signals();
    expect(opened).toHaveLength(1);
    expect(opened[0]).toMatchObject({ rule: 'nelson-1', status: 'open' });
    // The second point continued the episode rather than starting one.
    expect(await server.db('signal_points').where({ signal_id: opened[0].id }).count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(await server.db('audit_events').where({ action: 'signal.opened' }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('when a violation follows an in-control stretch, then it opens a new signal; a retried run opens none', async () => {
    await freezeBaseline();
    const retried = document(51);
    await ingestTestRun(server.db, retried);
    await ingest(inControl);
    await ingest([51.1]);
    expect((await signals()).map((s) => s.rule)).toEqual(['nelson-1', 'nelson-1']);
    await ingestTestRun(server.db, retried);
    expect(await signals()).toHaveLength(2);
  });

  it('when a signal is contained, then exactly the motors of the affected lot tested since the first violating run are held', async () => {
    await freezeBaseline();
    const otherLot = await createLot(server.db, plant.product);
    const [earlierInLot] = await ingest([50.05]);
    const [otherLotMotor] = await ingest([50.05], otherLot.code);
    const [violating, ...after] = await ingest([51, 50.05, 49.95]);
    const [signal] = await signals();
    const detail = await request(server.url).get(`/api/v1/signals/${signal.id}`).set('cookie', quality).expect(200);
    expect(detail.body.motors.map((m: { serial: string }) => m.serial).sort()).toEqual([violating, ...after].sort());
    expect(detail.body.signal.ruleText).toBe('One point more than 3 sigma from the centre line.');

    for (const cookie of [operator, manager]) await post(`/api/v1/signals/${signal.id}/contain`, cookie).expect(403);
    const contained = await post(`/api/v1/signals/${signal.id}/contain`, quality, { note: 'magnet lot suspect' }).expect(200);
    expect(contained.body.status).toBe('contained');
    const held = await server.db('holds').join('motors', 'motors.id', 'holds.motor_id').where({ 'holds.signal_id': signal.id }).whereNull('holds.released_at').pluck('motors.serial');
    expect(held.sort()).toEqual([violating, ...after].sort());
    const onHold = await server.db('motors').where({ status: 'on hold' }).pluck('serial');
    expect(onHold.sort()).toEqual([violating, ...after].sort());
    expect(onHold).not.toContain(earlierInLot);
    expect(onHold).not.toContain(otherLotMotor);
    expect(await server.db('audit_events').where({ action: 'signal.contained', entity_id: String(signal.id) }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('when motors already carry a manual hold and another signal\'s hold, then containment still holds them for this signal and closing releases only its own', async () => {
    await freezeBaseline();
    const [first, second] = await ingest([51, 50.05]);
    const [earlier] = await signals();
    await post(`/api/v1/signals/${earlier.id}/contain`, quality).expect(200);
    await post(`/api/v1/motors/${first}/holds`, quality, { reason: 'Noise at 3000 rpm' }).expect(201);
    await ingest(inControl);
    const [third] = await ingest([49]);
    // Retested after the new violation, the first motor falls within the new signal's scope too.
    await ingestTestRun(server.db, { ...document(50.05), serial: first });
    const later = (await signals()).at(-1)!;
    expect(later.id).not.toBe(earlier.id);
    const contained = await post(`/api/v1/signals/${later.id}/contain`, quality).expect(200);
    expect(contained.body.heldSerials.sort()).toEqual([first, third].sort());
    const heldByLater = await server.db('holds').join('motors', 'motors.id', 'holds.motor_id').where({ 'holds.signal_id': later.id }).whereNull('holds.released_at').pluck('motors.serial');
    expect(heldByLater.sort()).toEqual([first, third].sort());
    const disposition = { cause: 'stand fixture loose', actionTaken: 'fixture re-torqued', outcome: 'released' };
    await post(`/api/v1/signals/${later.id}/close`, quality, disposition).expect(200);
    expect(await server.db('holds').where({ signal_id: earlier.id }).whereNull('released_at').count({ n: '*' })).toEqual([{ n: 2 }]);
    expect(await server.db('motors').where({ serial: third }).first('status')).toEqual({ status: 'passed' });
    for (const serial of [first, second]) expect(await server.db('motors').where({ serial }).first('status')).toEqual({ status: 'on hold' });
  });

  it('when a contained signal is closed as released, then its holds are released; only quality may close', async () => {
    await freezeBaseline();
    await ingest([51, 50.05]);
    const [signal] = await signals();
    await post(`/api/v1/signals/${signal.id}/contain`, quality).expect(200);
    const disposition = { cause: 'stand fixture loose', actionTaken: 'fixture re-torqued, motors retested', outcome: 'released' };
    for (const cookie of [operator, manager]) await post(`/api/v1/signals/${signal.id}/close`, cookie, disposition).expect(403);
    const closed = await post(`/api/v1/signals/${signal.id}/close`, quality, disposition).expect(200);
    expect(closed.body).toMatchObject({ status: 'closed', releasedHolds: 2, closed: { cause: 'stand fixture loose', outcome: 'released' } });
    expect(await server.db('holds').where({ signal_id: signal.id }).whereNull('released_at').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await server.db('motors').where({ status: 'on hold' }).count({ n: '*' })).toEqual([{ n: 0 }]);
    await post(`/api/v1/signals/${signal.id}/close`, quality, disposition).expect(409);
  });
});
