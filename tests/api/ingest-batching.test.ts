import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Knex } from 'knex';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { jsonColumn } from '../../server/db/json-column.js';
import { freshState, phaseTwoStep, type SpcStateData } from '../../server/services/spc/phase-two-step.js';
import { AppError } from '../../server/errors.js';
import { createDb, statementPool } from '../../server/db/knex.js';
import { testConfig } from '../support/test-config.js';
import { testPorts } from '../support/ports.js';
import { createPlant, createProduct, createStation, nextSerial, runDocument, type PlantFixture } from '../factories.js';

// Stands post concurrently; the writer stores the runs that arrive together in one transaction.
// These tests post many runs at once and check that every run's record, and every summary kept
// on ingest (motor status, yield counters, SPC state, chart blocks), is exactly what storing the
// runs one by one would have left.

async function statusCount(db: Knex, name: 'Com_commit' | 'Com_rollback'): Promise<number> {
  const [rows] = await db.raw('SHOW GLOBAL STATUS LIKE ?', [name]);
  return Number((rows as Array<{ Value: string }>)[0].Value);
}

const commits = (db: Knex) => statusCount(db, 'Com_commit');

function withValue(plant: PlantFixture, code: string, value: number, overrides: Parameters<typeof runDocument>[1] = {}) {
  const document = runDocument(plant, overrides);
  document.results = document.results.map((r) => (r.characteristic === code ? { ...r, value } : r));
  return document;
}

describe('ingest of runs posted at the same time', () => {
  let server: RunningServer;
  let plant: PlantFixture;

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
  });

  /** 100 runs in control, EWMA trial limits of bemf.ke from them, frozen by quality: the state to judge from. */
  async function frozenEwmaOfKe() {
    const quality = (await signIn(server.url, 'quality')).cookie;
    const ke = plant.product.characteristics.find((c) => c.code === 'bemf.ke')!.id;
    for (let i = 0; i < 100; i++) await ingestTestRun(server.db, withValue(plant, 'bemf.ke', i % 2 === 0 ? 49.9 : 50.1));
    const post = (path: string) => request(server.url).post(path).set('cookie', quality).set('x-fluxtrail-csrf', '1');
    const trial = await post(`/api/v1/spc/characteristics/${ke}/trial-limits`).send({ chartKind: 'ewma' }).expect(201);
    await post(`/api/v1/spc/control-limits/${trial.body.id}/freeze`).send({}).expect(200);
    const frozen = jsonColumn<SpcStateData>((await server.db('spc_state').where({ characteristic_id: ke }).first('state_json')).state_json);
    const lastBaselineRun = Number((await server.db('test_runs').max({ id: 'id' }).first())?.id);
    return { ke, frozen, lastBaselineRun };
  }

  /** The characteristic's stored values after a run, in run order. */
  function seriesAfter(characteristicId: number, runId: number): Promise<Array<{ runId: number; lotId: number; value: number }>> {
    return server.db('measurements').join('test_runs', 'test_runs.id', 'measurements.run_id')
      .where('measurements.characteristic_id', characteristicId).andWhere('test_runs.id', '>', runId)
      .orderBy('test_runs.id').select('test_runs.id as runId', 'test_runs.lot_id as lotId', 'measurements.value');
  }

  it('when 24 stands post at once, then every run is stored once, in a few shared transactions, and the rollups add up', async () => {
    // Every third run fails bemf.ke (USL 52).
    const documents = Array.from({ length: 24 }, (_, i) => withValue(plant, 'bemf.ke', i % 3 === 0 ? 53 : 50.3));
    const before = await commits(server.db);
    const outcomes = await Promise.all(documents.map((d) => ingestTestRun(server.db, d)));
    const used = (await commits(server.db)) - before;

    expect(outcomes.map((o) => o.status)).toEqual(documents.map(() => 201));
    expect(outcomes.map((o) => o.body.verdict)).toEqual(documents.map((_, i) => (i % 3 === 0 ? 'fail' : 'pass')));
    // One transaction per run would be 24 commits; the first run goes alone, the rest together.
    expect(used).toBeLessThanOrEqual(6);

    const runs = await server.db('test_runs').orderBy('id').select('id', 'run_uuid', 'motor_id', 'attempt', 'verdict');
    expect(runs.map((r) => r.run_uuid).sort()).toEqual(documents.map((d) => d.runId).sort());
    expect(runs.every((r) => r.attempt === 1)).toBe(true);
    expect(await server.db('measurements').count({ n: '*' })).toEqual([{ n: 24 * documents[0].results.length }]);

    const motors = await server.db('motors').select('id', 'serial', 'status', 'attempts', 'latest_run_id');
    for (const document of documents) {
      const motor = motors.find((m) => m.serial === document.serial);
      const run = runs.find((r) => r.run_uuid === document.runId);
      expect(motor).toMatchObject({ attempts: 1, latest_run_id: run.id, status: run.verdict === 'pass' ? 'passed' : 'failed' });
    }

    const counts = (await server.db('yield_counts').sum({ tested: 'tested', first: 'passed_first', final: 'passed_final' }).first())!;
    expect([counts.tested, counts.first, counts.final].map(Number)).toEqual([24, 16, 16]);
    const failures = await server.db('yield_first_failures').count({ n: '*' }).first();
    expect(Number(failures?.n)).toBe(8);

    const ke = plant.product.characteristics.find((c) => c.code === 'bemf.ke')!.id;
    const blocks = (await server.db('spc_display_blocks').where({ characteristic_id: ke }).sum({ n: 'n', sum: 'sum' }).min({ low: 'min_value' }).max({ high: 'max_value' }).first())!;
    expect(Number(blocks.n)).toBe(24);
    expect(Number(blocks.sum)).toBeCloseTo(8 * 53 + 16 * 50.3, 9);
    expect([blocks.low, blocks.high]).toEqual([50.3, 53]);
  });

  it('when one run of a batch names a serial built as another product, then only that run is refused and the others are stored', async () => {
    const other = await createProduct(server.db, { serialPrefix: plant.product.serialPrefix });
    const taken = nextSerial(plant.product);
    await server.db('motors').insert({ serial: taken, product_id: other.id, lot_id: plant.lot.id, status: 'not tested', attempts: 0, created_at: new Date() });
    const documents = Array.from({ length: 10 }, (_, i) => runDocument(plant, i === 4 ? { serial: taken } : {}));

    const settled = await Promise.allSettled(documents.map((d) => ingestTestRun(server.db, d)));

    const refused = settled[4];
    expect(refused.status).toBe('rejected');
    const error = (refused as PromiseRejectedResult).reason as AppError;
    expect(error.status).toBe(422);
    expect(error.fields).toEqual([{ field: 'serial', message: `serial ${taken} was built as another product` }]);
    expect(settled.filter((s) => s.status === 'fulfilled')).toHaveLength(9);
    const stored = await server.db('test_runs').pluck('run_uuid');
    expect(stored.sort()).toEqual(documents.filter((_, i) => i !== 4).map((d) => d.runId).sort());
    expect(await server.db('motors').where({ serial: taken }).first('attempts', 'latest_run_id')).toEqual({ attempts: 0, latest_run_id: null });
  });

  it('when several runs of one serial arrive together with others, then its attempts count 1, 2, 3 and the motor points at the last', async () => {
    const serial = nextSerial(plant.product);
    const retests = [53, 53, 50.3].map((value) => withValue(plant, 'bemf.ke', value, { serial }));
    const others = Array.from({ length: 6 }, () => runDocument(plant));

    const outcomes = await Promise.all([...retests, ...others].map((d) => ingestTestRun(server.db, d)));

    expect(outcomes.slice(0, 3).map((o) => o.body.attempt).sort()).toEqual([1, 2, 3]);
    const runs = await server.db('test_runs').join('motors', 'motors.id', 'test_runs.motor_id').where('motors.serial', serial)
      .orderBy('attempt').select('test_runs.id', 'attempt', 'run_uuid');
    expect(runs.map((r) => r.attempt)).toEqual([1, 2, 3]);
    const motor = await server.db('motors').where({ serial }).first('attempts', 'latest_run_id', 'status');
    expect(motor).toEqual({ attempts: 3, latest_run_id: runs[2].id, status: outcomes.find((o) => o.body.attempt === 3)!.body.verdict === 'pass' ? 'passed' : 'failed' });
    const filed = await server.db('yield_motors').join('motors', 'motors.id', 'yield_motors.motor_id').where('motors.serial', serial).first('yield_motors.attempts', 'first_run_id');
    expect(filed).toEqual({ attempts: 3, first_run_id: runs[0].id });
  });

  it('when two statements are sent in one query, then only the pool of the ingest writer and the motor record runs them', async () => {
    // The app's pool keeps one statement per query, so a mistake elsewhere can never chain statements.
    await expect(server.db.raw('SELECT 1 AS one; SELECT 2 AS two')).rejects.toMatchObject({ code: 'ER_PARSE_ERROR' });
    const [results] = await statementPool(server.db)!.raw('SELECT 1 AS one; SELECT 2 AS two');
    expect(results).toEqual([[{ one: 1 }], [{ two: 2 }]]);
  });

  it('when a revision was approved after this process last read the revisions, then the run is judged by it', async () => {
    const first = await ingestTestRun(server.db, runDocument(plant));
    expect(first.body.limitRevision).toBe(1);
    // Another app process approves revision 2 (bemf.ke USL 50.2, in force since an hour ago):
    // this process's list of revisions is not told.
    const [revision2] = await server.db('limit_sets').insert({
      product_id: plant.product.id, revision: 2, status: 'approved', effective_from: new Date(Date.now() - 3_600_000),
      authored_by: 'test-quality', authored_by_name: 'Test Quality', authored_at: new Date(),
      approved_by: 'test-quality2', approved_by_name: 'Test Quality Two', approved_at: new Date(),
    });
    await server.db('limits').insert(plant.product.characteristics.map((c) => ({
      limit_set_id: revision2, characteristic_id: c.id, lsl: c.lsl, nominal: c.nominal ?? null, usl: c.code === 'bemf.ke' ? 50.2 : c.usl,
    })));

    const second = await ingestTestRun(server.db, runDocument(plant));

    expect(second.body).toMatchObject({ limitRevision: 2, verdict: 'fail' });
    expect(second.body.results.find((r) => r.characteristic === 'bemf.ke')).toMatchObject({ usl: 50.2, verdict: 'fail' });
    const stored = await server.db('test_runs').where({ run_uuid: second.body.runId }).first('limit_set_id', 'verdict');
    expect(stored).toEqual({ limit_set_id: Number(revision2), verdict: 'fail' });
  });

  it('when runs judged against frozen limits arrive together, then the SPC state equals one built run by run in run order', async () => {
    const { ke, frozen, lastBaselineRun } = await frozenEwmaOfKe();

    // A drift upwards, posted 30 at a time.
    const values = Array.from({ length: 30 }, (_, i) => 50 + i * 0.01);
    await Promise.all(values.map((value) => ingestTestRun(server.db, withValue(plant, 'bemf.ke', value))));

    const series = await seriesAfter(ke, lastBaselineRun);
    let replayed = freshState(frozen.limits);
    for (const point of series) replayed = phaseTwoStep(replayed, { runId: point.runId, lotId: point.lotId, value: point.value }).state;
    const stored = jsonColumn<SpcStateData>((await server.db('spc_state').where({ characteristic_id: ke }).first('state_json')).state_json);
    const { episodes: _stored, ...storedState } = stored;
    const { episodes: _replayed, ...replayedState } = replayed;
    expect(storedState).toEqual(replayedState);
    expect(stored.ewma?.t).toBe(30);
  });
  it('when two app processes each write two batches at once, then every SPC state is still stepped in run order and a retested serial counts every attempt once', async () => {
    const { ke, frozen, lastBaselineRun } = await frozenEwmaOfKe();
    // A second knex instance has a writer of its own, as a second app process would.
    const second = createDb(testConfig({ database: 'fluxtrail_test', port: testPorts.apiApp, idpPort: testPorts.idp, smtpPort: testPorts.smtp }).db);
    try {
      const retested = nextSerial(plant.product);
      // Every fifth run retests one serial, posted through both processes (even and odd places).
      const documents = Array.from({ length: 96 }, (_, i) => withValue(plant, 'bemf.ke', 50 + (i % 12) * 0.02, i % 5 === 0 ? { serial: retested } : {}));
      // Sixteen stands at a time, alternating between the two processes.
      for (let from = 0; from < documents.length; from += 16) {
        await Promise.all(documents.slice(from, from + 16).map((d, i) => ingestTestRun(i % 2 === 0 ? server.db : second, d)));
      }

      const series = await seriesAfter(ke, lastBaselineRun);
      expect(series).toHaveLength(96);
      let replayed = freshState(frozen.limits);
      for (const point of series) replayed = phaseTwoStep(replayed, { runId: point.runId, lotId: point.lotId, value: point.value }).state;
      const stored = await server.db('spc_state').where({ characteristic_id: ke }).first('state_json', 'last_run_id');
      const { episodes: _stored, ...storedState } = jsonColumn<SpcStateData>(stored.state_json);
      const { episodes: _replayed, ...replayedState } = replayed;
      expect(storedState).toEqual(replayedState);
      expect(Number(stored.last_run_id)).toBe(series[series.length - 1].runId);
      const attempts = await server.db('test_runs').join('motors', 'motors.id', 'test_runs.motor_id').where('motors.serial', retested).orderBy('test_runs.id').pluck('attempt');
      // Counted under the motor's row lock: 1…20 in run order, none lost or doubled.
      expect(attempts).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    } finally {
      await second.destroy();
    }
  });
  it('when a batch holds runs from a stand overdue for calibration, then every run is stored once and each of those motors is held once', async () => {
    // A calibration hold writes the audit chain, which the writer's hand-driven transaction cannot: the batch goes through a knex one.
    const overdue = await createStation(server.db, { calibrationDue: '2020-01-31', clientId: null });
    const documents = Array.from({ length: 12 }, (_, i) => runDocument(plant, i % 4 === 0 ? { station: overdue.code } : {}));

    const outcomes = await Promise.all(documents.map((d) => ingestTestRun(server.db, d)));

    expect(outcomes.map((o) => o.status)).toEqual(documents.map(() => 201));
    expect((await server.db('test_runs').pluck('run_uuid')).sort()).toEqual(documents.map((d) => d.runId).sort());
    const overdueSerials = documents.filter((_, i) => i % 4 === 0).map((d) => d.serial).sort();
    const flagged = await server.db('test_runs').join('motors', 'motors.id', 'test_runs.motor_id').where({ calibration_ok: false }).pluck('motors.serial');
    expect(flagged.sort()).toEqual(overdueSerials);
    const holds = await server.db('holds').join('motors', 'motors.id', 'holds.motor_id').where({ 'holds.kind': 'calibration' }).pluck('motors.serial');
    expect(holds.sort()).toEqual(overdueSerials);
    const statuses = await server.db('motors').whereIn('serial', overdueSerials).pluck('status');
    expect(statuses).toEqual(overdueSerials.map(() => 'on hold'));
    const audited = await server.db('audit_events').where({ action: 'hold.placed' }).count({ n: '*' }).first();
    expect(Number(audited?.n)).toBe(overdueSerials.length);
  });

  it('when signals open inside batches, then every run is stored once and each episode opens one signal, audited', async () => {
    const { ke, frozen, lastBaselineRun } = await frozenEwmaOfKe();

    // Hold the writer busy: a run in control waits on the SPC state row, locked here, while
    // twenty more queue behind it; on release they are written as one batch, in which the values
    // far above the limits open signals. The writer foresees that, rolls its own transaction
    // back and writes the batch in a knex transaction.
    const rollbacksBefore = await statusCount(server.db, 'Com_rollback');
    const lock = await server.db.transaction();
    await lock('spc_state').where({ characteristic_id: ke }).forUpdate().first();
    const blocker = ingestTestRun(server.db, withValue(plant, 'bemf.ke', 50));
    await new Promise((resolve) => setTimeout(resolve, 300));
    const documents = Array.from({ length: 20 }, (_, i) => withValue(plant, 'bemf.ke', i % 7 === 0 ? 50 : 51.5));
    const posted = Promise.all(documents.map((d) => ingestTestRun(server.db, d)));
    await new Promise((resolve) => setTimeout(resolve, 300));
    await lock.commit();
    const outcomes = await posted;
    expect((await blocker).status).toBe(201);
    expect(await statusCount(server.db, 'Com_rollback')).toBeGreaterThan(rollbacksBefore);

    expect(outcomes.map((o) => o.status)).toEqual(documents.map(() => 201));
    expect(await server.db('test_runs').whereIn('run_uuid', documents.map((d) => d.runId)).count({ n: '*' })).toEqual([{ n: 20 }]);
    // The episodes that judging the stored series in run order opens and continues, whatever the batches were.
    const series = await seriesAfter(ke, lastBaselineRun);
    let state = freshState(frozen.limits);
    let opened = 0;
    let continued = 0;
    for (const point of series) {
      const step = phaseTwoStep(state, { runId: point.runId, lotId: point.lotId, value: point.value });
      if (!step.judged) { state = step.state; continue; }
      const episodes: SpcStateData['episodes'] = {};
      for (const broken of step.judged.broken) {
        if (state.episodes[broken.rule] === undefined) opened++;
        else continued++;
        episodes[broken.rule] = state.episodes[broken.rule] ?? -1;
      }
      state = { ...step.state, episodes };
    }
    expect(opened).toBeGreaterThan(0);
    const signals = await server.db('signals').where({ characteristic_id: ke }).pluck('id');
    expect(signals).toHaveLength(opened);
    const audited = await server.db('audit_events').where({ action: 'signal.opened', entity_type: 'signal' }).pluck('entity_id');
    expect(audited.map(Number).sort((a, b) => a - b)).toEqual(signals.map(Number).sort((a, b) => a - b));
    const points = await server.db('signal_points').whereIn('signal_id', signals).count({ n: '*' }).first();
    expect(Number(points?.n)).toBe(continued);
    // Every value was stepped through exactly once, the batches tried by hand first included.
    const stored = jsonColumn<SpcStateData>((await server.db('spc_state').where({ characteristic_id: ke }).first('state_json')).state_json);
    expect(stored.ewma?.t).toBe(21);
  });
});
