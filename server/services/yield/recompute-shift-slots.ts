import type { Knex } from 'knex';
import { offsetSpans } from './plant-time.js';
import { shiftsInOrder, type ShiftCalendar } from './shift-calendar.js';

/**
 * Files every motor of the rollups under the production day and shift of its first run in the
 * given calendar, then recounts the per-shift totals. One UPDATE in SQL, with the zone's offsets
 * spelt out as a CASE over the few spans between daylight-saving changes, because MariaDB's own
 * CONVERT_TZ needs time-zone tables a fresh server does not have. Same rule as slotOf().
 */
export async function refileYieldRollups(trx: Knex.Transaction, calendar: ShiftCalendar): Promise<void> {
  const range = await trx('yield_motors').min({ first: 'first_started_at' }).max({ last: 'first_started_at' }).first();
  if (range?.first) {
    const spans = offsetSpans(calendar.timeZone, new Date(range.first).getTime(), new Date(range.last).getTime() + 60_000);
    const offsetCase = spans.length === 1
      ? { sql: '?', bindings: [spans[0].offset] }
      : {
        sql: `CASE ${spans.slice(0, -1).map(() => 'WHEN first_started_at < ? THEN ?').join(' ')} ELSE ? END`,
        bindings: [...spans.slice(0, -1).flatMap((span, i) => [new Date(spans[i + 1].fromMs), span.offset]), spans[spans.length - 1].offset],
      };
    const plantMinutes = `(TIMESTAMPDIFF(MINUTE, '1970-01-01 00:00:00', first_started_at) + ${offsetCase.sql})`;
    const starts = shiftsInOrder(calendar);
    const latestFirst = [...starts].reverse();
    const shiftCase = `CASE ${latestFirst.map(() => `WHEN MOD(${plantMinutes}, 1440) >= ? THEN ?`).join(' ')} ELSE ? END`;
    await trx.raw(
      `UPDATE yield_motors SET shift_day = DATE_ADD('1970-01-01', INTERVAL FLOOR((${plantMinutes} - ?) / 1440) DAY), shift_code = ${shiftCase}`,
      [
        ...offsetCase.bindings, starts[0].startsMinute,
        ...latestFirst.flatMap((shift) => [...offsetCase.bindings, shift.startsMinute, shift.code]),
        latestFirst[0].code,
      ],
    );
  }
  await trx.raw('UPDATE yield_first_failures f JOIN yield_motors y ON y.motor_id = f.motor_id SET f.shift_day = y.shift_day');
  await trx('yield_counts').delete();
  await trx.raw(`
    INSERT INTO yield_counts (shift_day, shift_code, station_id, line, lot_id, product_id, tested, passed_first, passed_final)
    SELECT shift_day, shift_code, station_id, line, lot_id, product_id, COUNT(*), SUM(first_pass), SUM(final_pass)
    FROM yield_motors GROUP BY shift_day, shift_code, station_id, line, lot_id, product_id`);
}
