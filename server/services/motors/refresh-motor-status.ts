import type { Knex } from 'knex';
import type { Statement } from '../../db/statements.js';

/**
 * A motor's status, the one rule: on hold while any hold on the motor or on its lot is active;
 * otherwise the verdict of its latest run; not tested before its first run. It is stored in
 * motors.status (so lists can filter and count by it) and recomputed in the same transaction as
 * every run, hold and release that can change it.
 */
// Two EXISTS rather than one OR, so that each probe uses its own (…, released_at) index.
const activeHold = `(EXISTS (SELECT 1 FROM holds h WHERE h.motor_id = motors.id AND h.released_at IS NULL)
  OR EXISTS (SELECT 1 FROM holds h WHERE h.lot_id = motors.lot_id AND h.released_at IS NULL))`;

/** What a stored run changes on its motor. */
export type MotorRun = {
  serial: string; productId: number; lotId: number; stationId: number; finishedAt: Date; receivedAt: Date; verdict: 'pass' | 'fail';
};

/**
 * Creates or updates the motor row of each run of an ingest batch in one statement and returns
 * each row (id, serial, product and lot as stored, and its attempt count including this run). The
 * row leaves it with its last test, station and status, the columns the motors list is indexed by,
 * so that pointing it at the new run later changes no index (pointMotorsAtRunsStatement). New and
 * existing rows are locked either way, so runs of one serial count attempts one after the other.
 */
export function motorsForRunsStatement(runs: readonly MotorRun[]): Statement {
  const lotHeld = 'EXISTS (SELECT 1 FROM holds h WHERE h.lot_id = ? AND h.released_at IS NULL)';
  return {
    sql: `INSERT INTO motors (serial, product_id, lot_id, status, attempts, created_at, last_tested_at, last_station_id)
     VALUES ${runs.map(() => `(?, ?, ?, (SELECT CASE WHEN ${lotHeld} THEN 'on hold' WHEN ? = 'pass' THEN 'passed' ELSE 'failed' END), 1, ?, ?, ?)`).join(', ')}
     ON DUPLICATE KEY UPDATE attempts = attempts + 1, last_tested_at = VALUES(last_tested_at), last_station_id = VALUES(last_station_id),
       status = IF(EXISTS (SELECT 1 FROM holds h WHERE h.motor_id = motors.id AND h.released_at IS NULL), 'on hold', VALUES(status))
     RETURNING id, serial, product_id, lot_id, attempts`,
    bindings: runs.flatMap((run) => [run.serial, run.productId, run.lotId, run.lotId, run.verdict, run.receivedAt, run.finishedAt, run.stationId]),
  };
}

/**
 * Points each motor at the run just stored for it, and sets its status again from that run's
 * final verdict and the active holds (unchanged unless the run was judged again in the batch).
 */
export function pointMotorsAtRunsStatement(runs: ReadonlyArray<{ motorId: number; runId: number; verdict: 'pass' | 'fail' }>): Statement {
  const latest = runs.map(() => 'SELECT ? AS id, ? AS run_id, ? AS verdict').join(' UNION ALL ');
  return {
    sql: `UPDATE motors JOIN (${latest}) AS latest ON latest.id = motors.id
     SET motors.latest_run_id = latest.run_id,
         motors.status = CASE WHEN ${activeHold} THEN 'on hold' WHEN latest.verdict = 'pass' THEN 'passed' ELSE 'failed' END`,
    bindings: runs.flatMap((run) => [run.motorId, run.runId, run.verdict]),
  };
}

export type MotorScope = { motorId: number } | { lotId: number };

/** Recomputes the stored status of one motor or of every motor in a lot. Returns the rows touched. */
export async function refreshMotorStatuses(trx: Knex.Transaction, scope: MotorScope): Promise<number> {
  const where = 'motorId' in scope ? 'motors.id = ?' : 'motors.lot_id = ?';
  const [result] = await trx.raw(
    `UPDATE motors LEFT JOIN test_runs latest ON latest.id = motors.latest_run_id
     SET motors.status = CASE
       WHEN ${activeHold} THEN 'on hold'
       WHEN latest.id IS NULL THEN 'not tested'
       WHEN latest.verdict = 'pass' THEN 'passed'
       ELSE 'failed' END
     WHERE ${where}`,
    ['motorId' in scope ? scope.motorId : scope.lotId],
  );
  return Number((result as { affectedRows: number }).affectedRows);
}
