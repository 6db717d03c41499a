import type { Knex } from 'knex';
import { quarterMs } from './shift-calendar.js';

export type StoredRunForYield = {
  motorId: number; runId: number; attempt: number; startedAt: Date; verdict: 'pass' | 'fail';
  productId: number; lotId: number; station: { id: number; line: string };
  failingCharacteristicIds: number[];
};

/**
 * Keeps the yield rollups current inside the ingest transaction: a motor's first run writes its
 * row (group, time bucket, first verdict) and its failing characteristics; every later run only
 * moves the final verdict, because a motor counts where and when it was first tested.
 */
export async function updateYieldRollups(trx: Knex.Transaction, run: StoredRunForYield): Promise<void> {
  const passed = run.verdict === 'pass';
  if (run.attempt > 1) {
    await trx('yield_motors').where({ motor_id: run.motorId }).update({ final_pass: passed, attempts: run.attempt });
    return;
  }
  const group = {
    motor_id: run.motorId, product_id: run.productId, lot_id: run.lotId, station_id: run.station.id, line: run.station.line,
    first_quarter: Math.floor(run.startedAt.getTime() / quarterMs),
  };
  await trx('yield_motors').insert({ ...group, first_run_id: run.runId, first_started_at: run.startedAt, first_pass: passed, final_pass: passed, attempts: 1 });
  const failing = [...new Set(run.failingCharacteristicIds)];
  if (failing.length > 0) {
    await trx('yield_first_failures').insert(failing.map((characteristicId) => ({ ...group, characteristic_id: characteristicId })));
  }
}

/**
 * Refills the rollups from the record tables, for data written around ingest (the benchmark's
 * bulk loader, an import). Minutes since the epoch DIV 15 is the same bucket as in ingest, and
 * does not depend on the session time zone.
 */
export async function rebuildYieldRollups(db: Knex): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('yield_first_failures').delete();
    await trx('yield_motors').delete();
    await trx.raw(`
      INSERT INTO yield_motors (motor_id, product_id, lot_id, station_id, line, first_run_id, first_started_at, first_quarter, first_pass, final_pass, attempts)
      SELECT m.id, m.product_id, m.lot_id, f.station_id, s.line, f.id, f.started_at,
             TIMESTAMPDIFF(MINUTE, '1970-01-01 00:00:00', f.started_at) DIV 15, f.verdict = 'pass', l.verdict = 'pass', m.attempts
      FROM motors m
      JOIN test_runs f ON f.motor_id = m.id AND f.attempt = 1
      JOIN test_runs l ON l.motor_id = m.id AND l.attempt = m.attempts
      JOIN stations s ON s.id = f.station_id`);
    await trx.raw(`
      INSERT INTO yield_first_failures (motor_id, characteristic_id, product_id, lot_id, station_id, line, first_quarter)
      SELECT y.motor_id, ms.characteristic_id, y.product_id, y.lot_id, y.station_id, y.line, y.first_quarter
      FROM yield_motors y JOIN measurements ms ON ms.run_id = y.first_run_id AND ms.verdict = 'fail'`);
  });
}
