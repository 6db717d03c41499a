import type { Knex } from 'knex';
import type { SignalRow } from './signal-rows.js';

export type AffectedMotor = { id: number; serial: string; lot: string; status: string; heldBySignal: boolean };

/** The lot the episode began in and the lots of every later point of the same episode. */
export async function affectedLotIds(db: Knex, signal: Pick<SignalRow, 'id' | 'lot_id'>): Promise<number[]> {
  const later: Array<{ lot_id: number }> = await db('signal_points').join('test_runs', 'test_runs.id', 'signal_points.run_id')
    .where('signal_points.signal_id', signal.id).distinct('test_runs.lot_id');
  return [...new Set([signal.lot_id, ...later.map((r) => r.lot_id)])].sort((a, b) => a - b);
}

/**
 * Containment scope (Fluxtrail's choice): every motor of the affected lot(s) with a test run at
 * or after the first run of the broken pattern. Motors of those lots tested only before it were
 * judged in control and stay free; the whole lot is not held, so the rest of the line can ship.
 */
export async function affectedMotors(db: Knex, signal: Pick<SignalRow, 'id' | 'lot_id' | 'pattern_first_run_id'>): Promise<AffectedMotor[]> {
  const lots = await affectedLotIds(db, signal);
  const rows: Array<{ id: number; serial: string; lot: string; status: string; held: number | string | null }> = await db('motors')
    .join('lots', 'lots.id', 'motors.lot_id')
    .whereIn('motors.id', db('test_runs').whereIn('lot_id', lots).andWhere('id', '>=', signal.pattern_first_run_id).select('motor_id'))
    .orderBy('motors.serial')
    .select('motors.id', 'motors.serial', 'lots.code as lot', 'motors.status',
      db.raw('(SELECT COUNT(*) FROM holds h WHERE h.motor_id = motors.id AND h.signal_id = ? AND h.released_at IS NULL) AS held', [signal.id]));
  return rows.map((r) => ({ id: r.id, serial: r.serial, lot: r.lot, status: r.status, heldBySignal: Number(r.held) > 0 }));
}
