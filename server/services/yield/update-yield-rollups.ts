import type { Knex } from 'knex';
import { readShiftCalendar, slotOf, type ShiftCalendar } from './shift-calendar.js';
import type { Statement } from '../../db/statements.js';
import { refileYieldRollups } from './recompute-shift-slots.js';

export type StoredRunForYield = {
  motorId: number; runId: number; attempt: number; startedAt: Date; verdict: 'pass' | 'fail';
  productId: number; lotId: number; station: { id: number; line: string };
  failingCharacteristicIds: number[];
};

/**
 * Keeps the yield rollups current inside the ingest transaction (whose motor row locks order the
 * runs of one motor): a motor's first run files it under its day, shift, station and lot with its
 * failing characteristics; a later run only moves the final verdict, because a motor counts where
 * and when it was first tested. Retests are applied at once (they are few); the first runs of a
 * batch come back as statements, one per table, the counters summed per group first and upserted
 * in key order (so concurrent batches queue), to be sent with the batch's other writes.
 */
export function yieldStatementsAfterIngest(db: Knex, runs: readonly StoredRunForYield[], calendar: ShiftCalendar): Statement[] {
  const retests = runs.filter((run) => run.attempt > 1).flatMap(finalVerdictStatements);
  const firsts = runs.filter((run) => run.attempt === 1);
  if (firsts.length === 0) return retests;
  const filed = firsts.map((run) => {
    const slot = slotOf(calendar, run.startedAt);
    const group = { product_id: run.productId, lot_id: run.lotId, station_id: run.station.id, line: run.station.line, shift_day: slot.day };
    return { run, group, shiftCode: slot.shift, passed: run.verdict === 'pass' };
  });
  const statements: Statement[] = [
    ...retests,
    db('yield_motors').insert(filed.map(({ run, group, shiftCode, passed }) => ({
      ...group, motor_id: run.motorId, shift_code: shiftCode, first_run_id: run.runId, first_started_at: run.startedAt,
      first_pass: passed, final_pass: passed, attempts: 1,
    }))).toSQL(),
    yieldCountsStatement(filed.map(({ group, shiftCode, passed }) => ({ ...group, shift_code: shiftCode, passed }))),
  ];
  const failures = filed.flatMap(({ run, group }) => [...new Set(run.failingCharacteristicIds)].map((characteristicId) => ({ ...group, motor_id: run.motorId, characteristic_id: characteristicId })));
  if (failures.length > 0) statements.push(db('yield_first_failures').insert(failures).toSQL());
  return statements;
}

type CountedMotor = { shift_day: string; shift_code: string; station_id: number; line: string; lot_id: number; product_id: number; passed: boolean };

/** One upsert of the per-group counters, summed per primary key and sent in key order. */
function yieldCountsStatement(motors: readonly CountedMotor[]): Statement {
  const groups = new Map<string, { key: Omit<CountedMotor, 'passed'>; tested: number; passed: number }>();
  for (const { passed, ...key } of motors) {
    const id = JSON.stringify([key.shift_day, key.shift_code, key.station_id, key.line, key.lot_id, key.product_id]);
    const group = groups.get(id) ?? { key, tested: 0, passed: 0 };
    group.tested += 1;
    group.passed += passed ? 1 : 0;
    groups.set(id, group);
  }
  const sorted = [...groups.values()].sort((a, b) => compareKeys(a.key, b.key));
  return {
    sql: `INSERT INTO yield_counts (shift_day, shift_code, station_id, line, lot_id, product_id, tested, passed_first, passed_final)
     VALUES ${sorted.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}
     ON DUPLICATE KEY UPDATE tested = tested + VALUES(tested), passed_first = passed_first + VALUES(passed_first), passed_final = passed_final + VALUES(passed_final)`,
    bindings: sorted.flatMap(({ key, tested, passed }) => [key.shift_day, key.shift_code, key.station_id, key.line, key.lot_id, key.product_id, tested, passed, passed]),
  };
}

function compareKeys(a: Omit<CountedMotor, 'passed'>, b: Omit<CountedMotor, 'passed'>): number {
  const pairs: Array<[string | number, string | number]> = [
    [a.shift_day, b.shift_day], [a.shift_code, b.shift_code], [a.station_id, b.station_id], [a.line, b.line], [a.lot_id, b.lot_id], [a.product_id, b.product_id],
  ];
  for (const [x, y] of pairs) if (x !== y) return x < y ? -1 : 1;
  return 0;
}

/**
 * A retest: the motor stays filed where it was first tested; only its final verdict may move. The
 * group's counter moves by the change of the motor's final verdict, read in the same statement,
 * before the motor's own row takes the new verdict. (A motor not filed yet has no row: nothing moves.)
 */
function finalVerdictStatements(run: StoredRunForYield): Statement[] {
  const passed = run.verdict === 'pass' ? 1 : 0;
  return [
    {
      sql: `UPDATE yield_counts c JOIN yield_motors y
               ON c.shift_day = y.shift_day AND c.shift_code = y.shift_code AND c.station_id = y.station_id
              AND c.line = y.line AND c.lot_id = y.lot_id AND c.product_id = y.product_id
             SET c.passed_final = c.passed_final + (? - y.final_pass)
           WHERE y.motor_id = ? AND y.final_pass <> ?`,
      bindings: [passed, run.motorId, passed],
    },
    { sql: 'UPDATE yield_motors SET final_pass = ?, attempts = ? WHERE motor_id = ?', bindings: [passed, run.attempt, run.motorId] },
  ];
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
