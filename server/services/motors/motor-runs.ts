import type { Knex } from 'knex';
import { jsonColumn } from '../../db/json-column.js';
import type { Statement } from '../../db/statements.js';

export type RunResultView = {
  characteristic: string; name: string; unit: string; testStep: string;
  value: number; lsl: number | null; nominal: number | null; usl: number | null; verdict: 'pass' | 'fail';
};
export type RunView = {
  runId: string; attempt: number; verdict: 'pass' | 'fail'; startedAt: string; finishedAt: string;
  station: { code: string; line: string }; operatorBadge: string; programVersion: string;
  limitRevision: number | null; calibrationOk: boolean; calibrationDue: string;
  results: RunResultView[]; waveforms: Array<{ kind: string; summary: unknown }>;
  /** Raw readings the stand posted (insulation, hipot, winding resistance), as posted. */
  readings: Array<{ kind: string; reading: unknown }>;
};

/** A motor's id, given as a number or as a subquery that yields it. */
export type MotorIdValue = number | Knex.QueryBuilder;

/**
 * The four reads behind a motor's runs (runs, results, waveforms, readings), each through the
 * motor's index on test_runs, to be sent together with the rest of the motor's record.
 */
export function runsOfMotorStatements(db: Knex, motorId: MotorIdValue): Statement[] {
  const runIds = () => db('test_runs').where('motor_id', motorId).select('id');
  return [
    // Named columns: the stored retry answer (response_json) is not part of the record.
    db('test_runs').join('stations', 'stations.id', 'test_runs.station_id')
      .leftJoin('limit_sets', 'limit_sets.id', 'test_runs.limit_set_id')
      .where('test_runs.motor_id', motorId).orderBy('test_runs.attempt', 'desc')
      .select('test_runs.id', 'test_runs.run_uuid', 'test_runs.attempt', 'test_runs.verdict', 'test_runs.started_at', 'test_runs.finished_at',
        'test_runs.operator_badge', 'test_runs.program_version', 'test_runs.calibration_ok', 'test_runs.calibration_due',
        'stations.code as station_code', 'stations.line as station_line', 'limit_sets.revision as limit_revision'),
    db('test_runs').join('measurements', 'measurements.run_id', 'test_runs.id')
      .join('characteristics', 'characteristics.id', 'measurements.characteristic_id')
      .leftJoin('limits', (on) => on.on('limits.limit_set_id', 'test_runs.limit_set_id').andOn('limits.characteristic_id', 'measurements.characteristic_id'))
      .where('test_runs.motor_id', motorId).orderBy(['characteristics.sort_order', 'characteristics.id'])
      .select('measurements.run_id', 'characteristics.code', 'characteristics.name', 'characteristics.unit', 'characteristics.test_step',
        'measurements.value', 'measurements.lsl', 'limits.nominal', 'measurements.usl', 'measurements.verdict'),
    // In the order of each table's own index (run, then id or kind), so MariaDB sorts nothing.
    db('waveforms').whereIn('run_id', runIds()).orderBy(['run_id', 'id']).select('run_id', 'kind', 'summary_json'),
    db('raw_readings').whereIn('run_id', runIds()).orderBy(['run_id', 'kind']).select('run_id', 'kind', 'reading_json'),
  ].map((query) => query.toSQL());
}

export type RunRow = {
  id: number; run_uuid: string; attempt: number; verdict: 'pass' | 'fail'; started_at: Date; finished_at: Date;
  station_code: string; station_line: string; operator_badge: string; program_version: string;
  limit_revision: number | null; calibration_ok: number | boolean; calibration_due: Date;
};
export type ResultRow = {
  run_id: number; code: string; name: string; unit: string; test_step: string;
  value: number; lsl: number | null; nominal: number | null; usl: number | null; verdict: 'pass' | 'fail';
};
export type WaveformRow = { run_id: number; kind: string; summary_json: unknown };
export type ReadingRow = { run_id: number; kind: string; reading_json: unknown };

/** Every run of one motor, latest first, each with its results in test-plan order and the nominal of the revision it was judged by. */
export function runViews(runs: RunRow[], results: ResultRow[], waveforms: WaveformRow[], readings: ReadingRow[]): RunView[] {
  return runs.map((run) => ({
    runId: run.run_uuid, attempt: run.attempt, verdict: run.verdict,
    startedAt: run.started_at.toISOString(), finishedAt: run.finished_at.toISOString(),
    station: { code: run.station_code, line: run.station_line },
    operatorBadge: run.operator_badge, programVersion: run.program_version,
    limitRevision: run.limit_revision ?? null, calibrationOk: Boolean(run.calibration_ok),
    calibrationDue: run.calibration_due.toISOString().slice(0, 10),
    results: results.filter((r) => r.run_id === run.id).map((r) => ({
      characteristic: r.code, name: r.name, unit: r.unit, testStep: r.test_step,
      value: r.value, lsl: r.lsl, nominal: r.nominal, usl: r.usl, verdict: r.verdict,
    })),
    waveforms: waveforms.filter((w) => w.run_id === run.id).map((w) => ({ kind: w.kind, summary: jsonColumn(w.summary_json) })),
    readings: readings.filter((r) => r.run_id === run.id).map((r) => ({ kind: r.kind, reading: jsonColumn(r.reading_json) })),
  }));
}
