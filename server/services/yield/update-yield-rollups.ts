import type { Knex } from 'knex';
import { readShiftCalendar, slotOf } from './shift-calendar.js';
import { refileYieldRollups } from './recompute-shift-slots.js';

export type StoredRunForYield = {
  motorId: number; runId: number; attempt: number; startedAt: Date; verdict: 'pass' | 'fail';
  productId: number; lotId: number; station: { id: number; line: string };
  failingCharacteristicIds: number[];
};

/**
 * Keeps the yield rollups current inside the ingest transaction (whose motor row lock orders
 * the runs of one motor): a motor's first run files it under its day, shift, station and lot with
 * its failing characteristics; a later run only moves the final verdict, because a motor counts
 * where and when it was first tested.
 */
export async function updateYieldRollups(trx: Knex.Transaction, run: StoredRunForYield): Promise<void> {
  const passed = run.verdict === 'pass';
  if (run.attempt > 1) {
    const motor = await trx('yield_motors').where({ motor_id: run.motorId })
      .first('shift_day', 'shift_code', 'station_id', 'line', 'lot_id', 'product_id', 'final_pass');
    if (!motor) return;
    await trx('yield_motors').where({ motor_id: run.motorId }).update({ final_pass: passed, attempts: run.attempt });
    if (Boolean(motor.final_pass) !== passed) {
      const { final_pass: _previous, ...key } = motor;
      await trx('yield_counts').where(key).increment('passed_final', passed ? 1 : -1);
    }
    return;
  }
  const slot = slotOf(await readShiftCalendar(trx), run.startedAt);
  const group = { product_id: run.productId, lot_id: run.lotId, station_id: run.station.id, line: run.station.line, shift_day: slot.day };
  await trx('yield_motors').insert({
    ...group, motor_id: run.motorId, shift_code: slot.shift, first_run_id: run.runId, first_started_at: run.startedAt,
    first_pass: passed, final_pass: passed, attempts: 1,
  });
  const one = passed ? 1 : 0;
  await trx.raw(
    `INSERT INTO yield_counts (shift_day, shift_code, station_id, line, lot_id, product_id, tested, passed_first, passed_final)
     VALUES (?, ?, ?, ?, ?, ?, 1, ?, ?)
     ON DUPLICATE KEY UPDATE tested = tested + 1, passed_first = passed_first + VALUES(passed_first), passed_final = passed_final + VALUES(passed_final)`,
    [slot.day, slot.shift, run.station.id, run.station.line, run.lotId, run.productId, one, one],
  );
  const failing = [...new Set(run.failingCharacteristicIds)];
  if (failing.length > 0) {
    await trx('yield_first_failures').insert(failing.map((characteristicId) => ({ ...group, motor_id: run.motorId, characteristic_id: characteristicId })));
  }
}

/**
 * Refills the rollups from the record tables, for data written around ingest (the benchmark's
 * bulk loader, an import): every motor's first and latest run, filed in the calendar in force.
 */
export async function rebuildYieldRollups(db: Knex): Promise<void> {
  await db.transaction(async (trx) => {
    for (const table of ['yield_first_failures', 'yield_counts', 'yield_motors']) await trx(table).delete();
    // The day and shift are placeholders here; refileYieldRollups fills them in below.
    await trx.raw(`
      INSERT INTO yield_motors (motor_id, product_id, lot_id, station_id, line, first_run_id, first_started_at, shift_day, shift_code, first_pass, final_pass, attempts)
      SELECT m.id, m.product_id, m.lot_id, f.station_id, s.line, f.id, f.started_at, '1970-01-01', '', f.verdict = 'pass', l.verdict = 'pass', m.attempts
      FROM motors m
      JOIN test_runs f ON f.motor_id = m.id AND f.attempt = 1
      JOIN test_runs l ON l.motor_id = m.id AND l.attempt = m.attempts
      JOIN stations s ON s.id = f.station_id`);
    await trx.raw(`
      INSERT INTO yield_first_failures (motor_id, characteristic_id, product_id, lot_id, station_id, line, shift_day)
      SELECT y.motor_id, ms.characteristic_id, y.product_id, y.lot_id, y.station_id, y.line, y.shift_day
      FROM yield_motors y JOIN measurements ms ON ms.run_id = y.first_run_id AND ms.verdict = 'fail'`);
    await refileYieldRollups(trx, await readShiftCalendar(trx));
  });
}
