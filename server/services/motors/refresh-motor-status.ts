import type { Knex } from 'knex';

/**
 * A motor's status, the one rule: on hold while any hold on the motor or on its lot is active;
 * otherwise the verdict of its latest run; not tested before its first run. It is stored in
 * motors.status (so lists can filter and count by it) and recomputed in the same transaction as
 * every run, hold and release that can change it.
 */
// Two EXISTS rather than one OR, so that each probe uses its own (…, released_at) index.
const activeHold = `(EXISTS (SELECT 1 FROM holds h WHERE h.motor_id = motors.id AND h.released_at IS NULL)
  OR EXISTS (SELECT 1 FROM holds h WHERE h.lot_id = motors.lot_id AND h.released_at IS NULL))`;

export type LatestRun = { motorId: number; runId: number; attempt: number; stationId: number; finishedAt: Date; verdict: 'pass' | 'fail' };

/**
 * Points each motor at the run just stored for it and sets its status from that run's verdict and
 * the active holds: one statement for a whole ingest batch (the motors are already locked).
 */
export async function recordLatestRuns(trx: Knex.Transaction, runs: readonly LatestRun[]): Promise<void> {
  if (runs.length === 0) return;
  const latest = runs.map(() => 'SELECT ? AS id, ? AS attempts, ? AS run_id, ? AS station_id, ? AS finished_at, ? AS verdict').join(' UNION ALL ');
  await trx.raw(
    `UPDATE motors JOIN (${latest}) AS latest ON latest.id = motors.id
     SET motors.attempts = latest.attempts, motors.latest_run_id = latest.run_id, motors.last_station_id = latest.station_id,
         motors.last_tested_at = latest.finished_at,
         motors.status = CASE WHEN ${activeHold} THEN 'on hold' WHEN latest.verdict = 'pass' THEN 'passed' ELSE 'failed' END`,
    runs.flatMap((run) => [run.motorId, run.attempt, run.runId, run.stationId, run.finishedAt, run.verdict]),
  );
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
