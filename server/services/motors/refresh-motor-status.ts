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

/** The status expression for a motor whose latest run has just been given `verdict`. */
export function statusAfterRun(db: Knex, verdict: 'pass' | 'fail'): Knex.Raw {
  return db.raw(`CASE WHEN ${activeHold} THEN 'on hold' WHEN ? = 'pass' THEN 'passed' ELSE 'failed' END`, [verdict]);
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
