import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import { createDb } from '../../server/db/knex.js';
import { verifyAuditChain } from '../../server/services/audit/verify-chain.js';
import { demoSeed, seedDemoPlant, type DemoSeedReport } from '../../seeds/demo/seed-demo-plant.js';
import { calibrationHoldMotors, damagedMagnetSerials, demoSerials, driftingLotCode } from '../../seeds/demo/notable.js';
import { demoClock } from '../../seeds/demo/clock.js';
import { planMotors } from '../../seeds/demo/plan-motors.js';
import { truncateAll } from '../support/migrate.js';
import { testConfig } from '../support/test-config.js';
import { testPorts } from '../support/ports.js';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileBlobStore } from '../../server/blob-store/file-blob-store.js';

const now = new Date();
// A few hundred motors keep the test quick; FLUXTRAIL_DEMO_MOTORS=5000 checks (and times) the full demo.
const requestedMotors = Number(process.env.FLUXTRAIL_DEMO_MOTORS ?? 400);

describe('demo plant seed', () => {
  let db: Knex;
  let report: DemoSeedReport;
  const blobDir = mkdtempSync(join(tmpdir(), 'fluxtrail-seed-blobs-'));

  beforeAll(async () => {
    db = createDb(testConfig({ database: 'fluxtrail_test', port: testPorts.apiApp, idpPort: testPorts.idp, smtpPort: testPorts.smtp }).db);
    await truncateAll(db);
    report = await seedDemoPlant(db, { motors: requestedMotors, now, blobs: fileBlobStore(blobDir) });
    console.log(`demo seed (${requestedMotors} requested): ${report.motors} motors, ${report.runs} runs in ${report.elapsedMs} ms`);
  }, 180_000);
  afterAll(async () => {
    await db.destroy();
    rmSync(blobDir, { recursive: true, force: true });
  });

  it('when the newest PM motors and the notable faults are seeded, then they carry back-EMF waveforms analysed on ingest', async () => {
    const rows = await db('waveforms').join('test_runs', 'test_runs.id', 'waveforms.run_id').join('motors', 'motors.id', 'test_runs.motor_id')
      .where('motors.serial', demoSerials.damagedMagnet).select('waveforms.kind', 'waveforms.summary_json');
    expect(rows.length).toBe(2); // failed twice, each attempt with its spin
    expect(rows[0].kind).toBe('back-emf');
    const total = await db('waveforms').count({ n: '*' }).first();
    expect(Number(total?.n)).toBeGreaterThanOrEqual(200);
  });

  const motor = (serial: string) => db('motors').where({ serial }).first('id', 'status', 'attempts');
  const measurementsOf = (serial: string, attempt: number) => db('measurements')
    .join('test_runs', 'test_runs.id', 'measurements.run_id').join('motors', 'motors.id', 'test_runs.motor_id')
    .join('characteristics', 'characteristics.id', 'measurements.characteristic_id')
    .where({ 'motors.serial': serial, 'test_runs.attempt': attempt })
    .select('characteristics.code', 'measurements.value', 'measurements.verdict');
  const failedCodes = async (serial: string, attempt: number) =>
    (await measurementsOf(serial, attempt)).filter((m) => m.verdict === 'fail').map((m) => m.code).sort();

  it('when seeded small, then it builds three products, 21 lots and every planned motor with a run', async () => {
    expect(await db('products').count({ n: '*' }).first()).toEqual({ n: 3 });
    expect(await db('lots').count({ n: '*' }).first()).toEqual({ n: 21 });
    expect(await db('stations').count({ n: '*' }).first()).toEqual({ n: 4 });
    expect(report.motors).toBeGreaterThanOrEqual(requestedMotors);
    const tested = await db('motors').whereNot({ status: 'not tested' }).count({ n: '*' }).first();
    expect(tested?.n).toBe(report.motors);
    expect((await db('test_runs').count({ n: '*' }).first())?.n).toBe(report.runs);
  });

  it('when counted, then most motors passed and a few per cent failed on their first test', async () => {
    const passed = Number((await db('motors').where({ status: 'passed' }).count({ n: '*' }).first())?.n);
    expect(passed / report.motors).toBeGreaterThan(0.93);
    const firstFails = Number((await db('test_runs').where({ attempt: 1, verdict: 'fail' }).count({ n: '*' }).first())?.n);
    expect(firstFails / report.motors).toBeGreaterThan(0.02);
    expect(firstFails / report.motors).toBeLessThan(0.1);
  });

  it('when looking up the notable serials, then each has the status its story says', async () => {
    expect(await motor(demoSerials.passing)).toMatchObject({ status: 'passed', attempts: 1 });
    expect(await motor(demoSerials.failingThenPassed)).toMatchObject({ status: 'passed', attempts: 2 });
    expect(await failedCodes(demoSerials.failingThenPassed, 1)).toEqual(['r_unbalance']);
    expect(await motor(demoSerials.swappedSequence)).toMatchObject({ status: 'passed', attempts: 2 });
    expect(await failedCodes(demoSerials.swappedSequence, 1)).toEqual(['phase_sequence', 'phase_spacing_dev']);
    for (const serial of damagedMagnetSerials) {
      expect(await motor(serial)).toMatchObject({ status: 'failed', attempts: 2 });
      expect(await failedCodes(serial, 2)).toContain('emf_unbalance');
    }
    const held = await motor(demoSerials.onCalibrationHold);
    expect(held?.status).toBe('on hold');
    expect(await db('holds').where({ motor_id: held?.id, kind: 'calibration' }).whereNull('released_at').count({ n: '*' }).first()).toEqual({ n: 1 });
  });

  it('when the overdue station tested motors, then exactly those runs are out of calibration and held', async () => {
    const runs = await db('test_runs').join('stations', 'stations.id', 'test_runs.station_id')
      .where({ 'stations.code': 'EOL-B2', 'test_runs.calibration_ok': false }).select('test_runs.motor_id');
    expect(runs).toHaveLength(calibrationHoldMotors);
    expect(await db('test_runs').where({ calibration_ok: false }).count({ n: '*' }).first()).toEqual({ n: calibrationHoldMotors });
    expect(await db('motors').where({ status: 'on hold' }).count({ n: '*' }).first()).toEqual({ n: calibrationHoldMotors });
  });

  it('when comparing the drifting lot, then its last 20 motors have a higher Ke mean than its first 20', async () => {
    const ke = await db('measurements')
      .join('test_runs', 'test_runs.id', 'measurements.run_id').join('motors', 'motors.id', 'test_runs.motor_id')
      .join('lots', 'lots.id', 'motors.lot_id').join('characteristics', 'characteristics.id', 'measurements.characteristic_id')
      .where({ 'lots.code': driftingLotCode, 'characteristics.code': 'ke', 'test_runs.attempt': 1 })
      .orderBy('test_runs.started_at').select('measurements.value');
    const mean = (values: Array<{ value: number }>) => values.reduce((sum, v) => sum + v.value, 0) / values.length;
    expect(ke.length).toBeGreaterThanOrEqual(100);
    expect(mean(ke.slice(-20)) - mean(ke.slice(0, 20))).toBeGreaterThan(1.0);
  });

  it('when the drifting lot ran after Ke\'s control limits were frozen, then ingest opened signals on it first', async () => {
    const signals = await db('signals').join('lots', 'lots.id', 'signals.lot_id')
      .join('characteristics', 'characteristics.id', 'signals.characteristic_id')
      .orderBy('signals.first_run_id').select('lots.code as lot', 'characteristics.code as characteristic');
    expect(signals.length).toBeGreaterThan(0);
    expect(signals[0]).toEqual({ lot: driftingLotCode, characteristic: 'ke' });
    expect(await db('control_limits').where({ status: 'frozen' }).first('chart_kind')).toEqual({ chart_kind: 'ewma' });
  });

  it('when runs straddle the Ke tightening, then each is judged by the revision in force at its start', async () => {
    const revisionsBy = await db('test_runs').join('limit_sets', 'limit_sets.id', 'test_runs.limit_set_id')
      .join('products', 'products.id', 'limit_sets.product_id').where('products.code', 'PM-150')
      .select(db.raw('limit_sets.revision AS revision'), db.raw('MIN(test_runs.started_at) AS first'), db.raw('MAX(test_runs.started_at) AS last'))
      .groupBy('limit_sets.revision').orderBy('limit_sets.revision');
    const switchAt = demoClock(now).at(20).getTime();
    expect(revisionsBy.map((r) => r.revision)).toEqual([1, 2]);
    expect(new Date(revisionsBy[0].last).getTime()).toBeLessThan(switchAt);
    expect(new Date(revisionsBy[1].first).getTime()).toBeGreaterThanOrEqual(switchAt);
  });

  it('when planned twice for the same day, then serials, times, stations and faults are the same', () => {
    const summary = () => planMotors(demoSeed, demoClock(now), requestedMotors)
      .map((m) => [m.serial, ...m.attempts.map((a) => `${a.startedAt.toISOString()} ${a.stationCode} ${a.faults.join('+')}`)].join(' '));
    expect(summary()).toEqual(summary());
  });

  it('when reading the audit trail, then the limit approvals, the open draft and an intact chain are there', async () => {
    const approvals = await db('audit_events').where({ action: 'limit_set.approved' }).select('actor');
    expect(approvals).toHaveLength(4);
    expect(new Set(approvals.map((a) => a.actor))).toEqual(new Set(['Ana Sousa']));
    expect(await db('limit_sets').where({ status: 'draft' }).first('revision', 'authored_by')).toEqual({ revision: 3, authored_by: 'quality' });
    expect(await db('audit_events').where({ action: 'hold.placed' }).count({ n: '*' }).first()).toEqual({ n: calibrationHoldMotors });
    expect(await verifyAuditChain(db)).toMatchObject({ ok: true });
  });
});
