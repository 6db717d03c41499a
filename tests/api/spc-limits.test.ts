import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Knex } from 'knex';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { createLot, createPlant, runDocument, type PlantFixture } from '../factories.js';

/** Deterministic normal values (LCG + Box–Muller) so every run of the test sees the same data. */
function normalValues(count: number, mean: number, sd: number, seed = 7): number[] {
  let state = seed;
  const uniform = () => { state = (state * 1103515245 + 12345) % 2147483648; return (state + 1) / 2147483649; };
  return Array.from({ length: count }, () => mean + sd * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform()));
}

/**
 * Resolves once another connection of this user runs a statement on spc_state: the freeze, which
 * cannot finish it while the batch holds the state (PROCESSLIST shows a user's own connections).
 */
async function waitForFreezeAtState(db: Knex): Promise<void> {
  for (let i = 0; i < 200; i++) {
    const [rows] = await db.raw(
      "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE COMMAND = 'Query' AND INFO LIKE '%spc\\_state%' AND INFO NOT LIKE '%PROCESSLIST%'",
    );
    if (Number((rows as Array<{ n: number }>)[0].n) > 0) return;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  throw new Error('the freeze did not reach the SPC state within 5 s');
}

describe('SPC Phase I: trial limits, exclusions and the freeze', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let quality: string;
  let operator: string;
  let manager: string;
  const ke = () => plant.product.characteristics.find((c) => c.code === 'bemf.ke')!.id;
  const post = (path: string, cookie: string, body: object = {}) =>
    request(server.url).post(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body);

  async function ingest(values: number[], lot = plant.lot.code) {
    for (const value of values) {
      const document = runDocument(plant, { lot });
      document.results = document.results.map((r) => (r.characteristic === 'bemf.ke' ? { ...r, value } : r));
      await ingestTestRun(server.db, document);
    }
  }

  beforeAll(async () => {
    server = await startApiServer();
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
    // Sessions live in the database, so sign in after it was emptied.
    [quality, operator, manager] = (await Promise.all(['quality', 'operator', 'manager'].map((login) => signIn(server.url, login)))).map((s) => s.cookie);
  });

  it('when the window holds fewer than 100 values, then individuals trial limits answer 422 naming from', async () => {
    await ingest(normalValues(99, 50, 0.3));
    const response = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(422);
    expect(response.body.error.fields).toEqual([{ field: 'from', message: 'the window holds 99 values; trial limits need at least 100' }]);
  });

  it('when lots give fewer than 25 subgroups, then lot trial limits answer 422 naming from', async () => {
    for (let i = 0; i < 24; i++) {
      const lot = await createLot(server.db, plant.product);
      await ingest(normalValues(3, 50, 0.3, i + 1), lot.code);
    }
    const response = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'xbar-s-lot' }).expect(422);
    expect(response.body.error.fields[0]).toEqual({ field: 'from', message: 'the window holds 24 subgroups; trial limits need at least 25' });
  });

  it('when 100 values are in the window, then trial limits are x̄ ± 3·MR̄/d₂ of them and marked trial', async () => {
    const values = normalValues(100, 50, 0.3);
    await ingest(values);
    const response = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const mrBar = values.slice(1).reduce((sum, v, i) => sum + Math.abs(v - values[i]), 0) / (values.length - 1);
    expect(response.body.status).toBe('trial');
    expect(response.body.centre).toBeCloseTo(mean, 9);
    expect(response.body.ucl).toBeCloseTo(mean + 3 * mrBar / (2 / Math.sqrt(Math.PI)), 9);
    expect(response.body.rules).toEqual(['nelson-1', 'nelson-2', 'nelson-3', 'nelson-5']);
    const chart = await request(server.url).get(`/api/v1/spc/characteristics/${ke()}/chart`).set('cookie', quality).expect(200);
    expect(chart.body.limits.trial.id).toBe(response.body.id);
    expect(chart.body.limits.frozen).toBeNull();
    expect(chart.body.points).toHaveLength(100);
  });

  it('when a point is excluded with a reason, then the trial limits are recomputed without it', async () => {
    const values = [...normalValues(100, 50, 0.3)];
    values[40] = 58; // a gross outlier with an assignable cause
    await ingest(values);
    const trial = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    const [outlier] = await server.db('measurements').where({ characteristic_id: ke(), value: 58 }).select('run_id');
    const excluded = await post(`/api/v1/spc/control-limits/${trial.body.id}/exclusions`, quality, { runId: Number(outlier.run_id), reason: 'fixture not seated' }).expect(201);
    expect(excluded.body.exclusions).toEqual([expect.objectContaining({ runId: Number(outlier.run_id), reason: 'fixture not seated' })]);
    expect(excluded.body.baseline.points).toBe(99);
    expect(excluded.body.centre).toBeLessThan(trial.body.centre);
    expect(excluded.body.ucl - excluded.body.lcl).toBeLessThan(trial.body.ucl - trial.body.lcl);
  });

  it('when trial limits are frozen, then the freeze is audited with who, when and which window', async () => {
    await ingest(normalValues(100, 50, 0.3));
    const trial = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    const frozen = await post(`/api/v1/spc/control-limits/${trial.body.id}/freeze`, quality).expect(200);
    expect(frozen.body).toMatchObject({ status: 'frozen', frozenBy: 'Piet Lindqvist' });
    const event = await server.db('audit_events').where({ action: 'control-limits.frozen' }).first();
    expect(event).toMatchObject({ actor: 'Piet Lindqvist', actor_role: 'quality', entity_type: 'characteristic', entity_id: String(ke()) });
    const after = typeof event.after_json === 'string' ? JSON.parse(event.after_json) : event.after_json;
    expect(after).toMatchObject({ limitId: trial.body.id, status: 'frozen', baseline: trial.body.baseline, frozenBy: 'Piet Lindqvist', frozenAt: frozen.body.frozenAt });
    const state = await server.db('spc_state').where({ characteristic_id: ke() }).first();
    expect(state.control_limit_id).toBe(trial.body.id);
    await post(`/api/v1/spc/control-limits/${trial.body.id}/freeze`, quality).expect(409);
  });

  it('when limits are frozen while an ingest batch holds the SPC state and then checks the frozen limits, then both finish without a deadlock', async () => {
    await ingest(normalValues(100, 50, 0.3));
    const first = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    await post(`/api/v1/spc/control-limits/${first.body.id}/freeze`, quality).expect(200);
    const second = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);

    // An ingest batch in its own transaction: it locks the state, as the writer's second round
    // trip does; its later writes (the state, a signal) check the frozen limits' key.
    const batch = await server.db.transaction();
    try {
      await batch('spc_state').where({ characteristic_id: ke() }).forUpdate().first();
      // then() sends the request now; the test goes on while the freeze waits for the state.
      const freezing = post(`/api/v1/spc/control-limits/${second.body.id}/freeze`, quality).then((r) => r);
      await waitForFreezeAtState(server.db);
      await batch('control_limits').where({ id: first.body.id }).forShare().first('id');
      await batch('spc_state').where({ characteristic_id: ke() }).update({ updated_at: new Date() });
      await batch.commit();
      const frozen = await freezing;
      expect(frozen.status).toBe(200);
      expect(frozen.body).toMatchObject({ id: second.body.id, status: 'frozen' });
    } finally {
      if (!batch.isCompleted()) await batch.rollback();
    }
    const statuses = await server.db('control_limits').where({ characteristic_id: ke() }).orderBy('id').pluck('status');
    expect(statuses).toEqual(['superseded', 'frozen']);
    expect((await server.db('spc_state').where({ characteristic_id: ke() }).first()).control_limit_id).toBe(second.body.id);
  });

  it('when an operator or a manager tries to compute or freeze limits, then the answer is 403 and nothing changes', async () => {
    await ingest(normalValues(100, 50, 0.3));
    const trial = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, quality, { chartKind: 'individuals' }).expect(201);
    for (const cookie of [operator, manager]) {
      await post(`/api/v1/spc/control-limits/${trial.body.id}/freeze`, cookie).expect(403);
      await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, cookie, { chartKind: 'individuals' }).expect(403);
    }
    expect(await server.db('control_limits').where({ status: 'frozen' }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
