import type { Knex } from 'knex';
import { invalid } from '../../errors.js';
import type { ResultInput, TestRunDocument, TestRunResponse } from '../../schemas/test-run.js';
import { motorsForRunsStatement, pointMotorsAtRunsStatement } from '../motors/refresh-motor-status.js';
import { runStatements, TransactionNeeded, type Statement } from '../../db/statements.js';
import { jsonValue, numberLiteral, wordLiteral } from '../../db/sql-literals.js';
import { placeHold } from '../holds/place-hold.js';
import { signalWouldOpen, spcStateLockStatement, spcStateReadStatement, spcStatementsAfterIngest, type IngestedRun, type SpcStateRow } from '../spc/evaluate-after-ingest.js';
import { yieldStatementsAfterIngest } from '../yield/update-yield-rollups.js';
import { shiftCalendarFromRows, shiftCalendarStatement } from '../yield/shift-calendar.js';
import { approvedRevisionsStatement, rememberRevisionRows, type LimitSetInForce } from './limits-in-force.js';
import type { judgeRun } from './judge-run.js';
import type { ProductRef } from './reference-data.js';
import type { StationRef } from './station-of-client.js';
import { confirmLimitsInForce } from './confirm-limits.js';
import { waveformsAndReadingsStatements, type KeptRawData } from './store-waveforms-and-readings.js';
import type { SendStatements } from '../../db/direct-transaction.js';

/** A run that passed every check and has been judged: all that is left is to write it. */
export type RunToStore = {
  document: TestRunDocument; sha256: string; station: StationRef; product: ProductRef; lotId: number;
  /** Posted and derived results, as judged (again, should the revision in force have changed). */
  results: ResultInput[]; limitSet: LimitSetInForce; judged: ReturnType<typeof judgeRun>;
  raw: KeptRawData; source: 'station' | 'upload'; receivedAt: Date;
};

/**
 * Where a batch's statements go: a knex transaction (`trx`), or a transaction driven by hand on a
 * multi-statement connection (directTransaction, `trx` null), which cannot run the rare writes
 * that read as they go (calibration holds, opened signals: TransactionNeeded). `db` builds
 * statements and reads what never changes once written (approved limits).
 */
export type BatchChannel = { db: Knex; trx: Knex.Transaction | null; send: SendStatements };

/** A channel over a knex transaction. */
export function transactionChannel(trx: Knex.Transaction): BatchChannel {
  return { db: trx, trx, send: (statements) => runStatements(trx, statements) };
}

/** The calibration due date is a plant calendar date, so it is compared with the stand's local date. */
export function calibrationOkFor(run: RunToStore): boolean {
  return run.station.calibrationDue >= run.document.startedAt.slice(0, 10);
}

type LockedMotor = { id: number; serial: string; product_id: number; lot_id: number; attempts: number };

/**
 * Writes a batch of checked runs of distinct serials in the channel's transaction and returns each
 * run's answer, in the order given. Every table gets one statement for the whole batch, and the
 * statements travel in three round trips: reads and the motor rows; the SPC state they lock and
 * the runs; every other write (on a direct channel the first carries START TRANSACTION and the
 * last COMMIT). Hot rows (SPC state, display blocks, yield counters)
 * are thus locked once per batch, for a short time. Lock order, as in every ingest: motor rows (by
 * serial) → SPC state → runs → measurements, motor pointers, display blocks → yield rollups →
 * calibration holds and their audit. Throws when any run cannot be stored (a serial of another
 * product or lot, a runId already taken): the caller rolls back and stores the runs one by one;
 * on a direct channel, TransactionNeeded before anything is kept: the caller uses a knex one.
 */
export async function storeRuns(channel: BatchChannel, runs: RunToStore[]): Promise<TestRunResponse[]> {
  const { db, trx, send } = channel;
  const holds = runs.filter((run) => !calibrationOkFor(run));
  if (holds.length > 0 && !trx) throw new TransactionNeeded('a calibration hold is placed');
  const bySerial = [...runs].sort((a, b) => (a.document.serial < b.document.serial ? -1 : a.document.serial > b.document.serial ? 1 : 0));
  const productIds = [...new Set(runs.map((run) => run.product.id))];
  const characteristicIds = [...new Set(runs.flatMap((run) => run.judged.results.map((r) => r.characteristicId)))].sort((a, b) => a - b);
  const [revisionRows, calendarRows, motorRows, spcSnapshot] = await send([
    approvedRevisionsStatement(db, productIds),
    shiftCalendarStatement,
    motorsForRunsStatement(bySerial.map((run) => ({
      serial: run.document.serial, productId: run.product.id, lotId: run.lotId, stationId: run.station.id,
      finishedAt: new Date(run.document.finishedAt), receivedAt: run.receivedAt, verdict: run.judged.verdict,
    }))),
    // Without a knex transaction a signal cannot open: read the states now to foresee one.
    ...(trx ? [] : [spcStateReadStatement(db, characteristicIds)]),
  ]) as [Parameters<typeof rememberRevisionRows>[1], Parameters<typeof shiftCalendarFromRows>[0], LockedMotor[], SpcStateRow[] | undefined];
  const motors = checkedMotors(runs, motorRows);
  await confirmLimitsInForce(db, runs, rememberRevisionRows(productIds, revisionRows));

  const stored = runs.map((run) => {
    const motor = motors.get(run.document.serial) as LockedMotor;
    const calibrationOk = calibrationOkFor(run);
    const response: TestRunResponse = {
      runId: run.document.runId, serial: run.document.serial, attempt: motor.attempts, verdict: run.judged.verdict, limitRevision: run.limitSet.revision,
      results: run.judged.results.map(({ characteristicId: _id, ...result }) => result),
    };
    return { run, motorId: motor.id, attempt: motor.attempts, calibrationOk, response, runId: 0 };
  });
  // The runs will be numbered in this order; a signal foreseen goes to a knex transaction before anything is written.
  if (spcSnapshot && signalWouldOpen(stored.map((s, i) => ingestedRun(s, i + 1)), spcSnapshot)) throw new TransactionNeeded('an SPC signal opens');
  // The SPC state is locked before the runs get their ids: of two batches written at once (by one
  // writer or two processes) that share a characteristic, the one stepping its state first then
  // also has the lower run ids, so every state is stepped in run order, as the charts show it.
  const [stateRows, runRows] = await send([spcStateLockStatement(db, characteristicIds), insertRunsStatement(stored)]) as [SpcStateRow[], Array<{ id: number | string; run_uuid: string }>];
  const runIds = new Map(runRows.map((row) => [row.run_uuid, Number(row.id)]));
  for (const s of stored) s.runId = runIds.get(s.run.document.runId) as number;

  const spc = await spcStatementsAfterIngest(db, trx, stored.map((s) => ingestedRun(s, s.runId)), stateRows);
  const yieldRollups = yieldStatementsAfterIngest(db, stored.map((s) => ({
    motorId: s.motorId, runId: s.runId, attempt: s.attempt, startedAt: new Date(s.run.document.startedAt), verdict: s.run.judged.verdict,
    productId: s.run.product.id, lotId: s.run.lotId, station: s.run.station,
    failingCharacteristicIds: s.run.judged.results.filter((r) => r.verdict === 'fail').map((r) => r.characteristicId),
  })), shiftCalendarFromRows(calendarRows));
  await send([
    measurementsStatement(stored),
    ...stored.flatMap((s) => waveformsAndReadingsStatements(db, s.runId, s.run.raw)),
    pointMotorsAtRunsStatement(stored.map((s) => ({ motorId: s.motorId, runId: s.runId, verdict: s.run.judged.verdict }))),
    ...spc.statements,
    ...yieldRollups,
  ], { last: holds.length === 0 });
  if (trx) for (const run of holds) await holdForCalibration(trx, run);
  return stored.map((s) => s.response);
}

/** A stored run as the SPC evaluation sees it, under the given run id. */
function ingestedRun(s: StoredRun, runId: number): IngestedRun {
  return {
    runId, motorId: s.motorId, lotId: s.run.lotId, productId: s.run.product.id, startedAt: s.run.document.startedAt,
    receivedAt: s.run.receivedAt, measurements: s.run.judged.results,
  };
}

/** Every run's motor row, as the batch found or made it: of the run's product and lot. */
function checkedMotors(runs: readonly RunToStore[], rows: readonly LockedMotor[]): Map<string, LockedMotor> {
  const motors = new Map(rows.map((row) => [row.serial, { ...row, id: Number(row.id) }]));
  for (const run of runs) {
    const motor = motors.get(run.document.serial);
    if (!motor) throw new Error(`motor ${run.document.serial} was neither created nor found`);
    if (motor.product_id !== run.product.id) throw invalid([{ field: 'serial', message: `serial ${run.document.serial} was built as another product` }]);
    if (motor.lot_id !== run.lotId) throw invalid([{ field: 'lot', message: `serial ${run.document.serial} belongs to another lot` }]);
  }
  return motors;
}

type StoredRun = { run: RunToStore; motorId: number; attempt: number; calibrationOk: boolean; response: TestRunResponse };

/** The batch's test_runs rows, returning the id given to each runId. */
function insertRunsStatement(stored: readonly StoredRun[]): Statement {
  const columns = [
    'run_uuid', 'motor_id', 'station_id', 'lot_id', 'attempt', 'started_at', 'finished_at', 'operator_badge', 'program_version',
    'limit_set_id', 'verdict', 'calibration_ok', 'calibration_due', 'body_sha256', 'response_json', 'source', 'received_at',
  ];
  return {
    sql: `INSERT INTO test_runs (${columns.join(', ')})
     VALUES ${stored.map(() => `(${columns.map(() => '?').join(', ')})`).join(', ')}
     RETURNING id, run_uuid`,
    bindings: stored.flatMap(({ run, motorId, attempt, calibrationOk, response }) => [
      run.document.runId, motorId, run.station.id, run.lotId, attempt, new Date(run.document.startedAt), new Date(run.document.finishedAt),
      run.document.operatorBadge, run.document.programVersion, run.limitSet.id, run.judged.verdict, calibrationOk, run.station.calibrationDue,
      run.sha256, jsonValue(response), run.source, run.receivedAt,
    ]),
  };
}

/**
 * Every measurement of the batch in one statement, its values written into the text (all numbers
 * the app checked, and verdicts): a batch of 16 runs would otherwise bind 3,840 values.
 */
function measurementsStatement(stored: ReadonlyArray<StoredRun & { runId: number }>): Statement {
  const rows: string[] = [];
  for (const { run, runId } of stored) {
    for (const r of run.judged.results) {
      rows.push(`(${numberLiteral(runId)}, ${numberLiteral(r.characteristicId)}, ${numberLiteral(r.value)}, ${numberLiteral(r.lsl)}, ${numberLiteral(r.usl)}, ${wordLiteral(r.verdict, verdicts)})`);
    }
  }
  return { sql: `INSERT INTO measurements (run_id, characteristic_id, value, lsl, usl, verdict) VALUES ${rows.join(', ')}`, bindings: [] };
}

const verdicts = ['pass', 'fail'] as const;

/** A run from a station whose calibration had expired is kept, flagged, and holds its motor. */
async function holdForCalibration(trx: Knex.Transaction, run: RunToStore): Promise<void> {
  const { document, station } = run;
  await placeHold(trx, {
    // A retest on an overdue stand keeps the hold already placed; the run itself records its calibration state.
    target: { type: 'motor', serial: document.serial }, kind: 'calibration', at: run.receivedAt, ifAlreadyHeld: 'keep',
    actor: { name: `station ${station.code}`, role: null },
    reason: `Tested on station ${station.code} on ${document.startedAt.slice(0, 10)}, after its calibration fell due on ${station.calibrationDue}; retest on a calibrated station or disposition the run.`,
  });
}
