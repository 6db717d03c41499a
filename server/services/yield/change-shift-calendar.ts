import type { Knex } from 'knex';
import { invalid } from '../../errors.js';
import { recordAudit, type Actor } from '../audit/record-audit.js';
import { readShiftCalendar, type ShiftCalendar } from './shift-calendar.js';
import { refileYieldRollups } from './recompute-shift-slots.js';

import { shiftCalendarBodySchema, type ShiftCalendarBody } from '../../schemas/shift-calendar.js';

export { shiftCalendarBodySchema, type ShiftCalendarBody };

const minutesOf = (clockTime: string) => Number(clockTime.slice(0, 2)) * 60 + Number(clockTime.slice(3, 5));
export const clockOf = (minutes: number) => `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;

/** The calendar as the API shows it: shift starts as HH:MM. */
export function presentCalendar(calendar: ShiftCalendar) {
  return { ...calendar, shifts: calendar.shifts.map((s) => ({ code: s.code, name: s.name, startsAt: clockOf(s.startsMinute) })) };
}

/**
 * Replaces the plant's shifts, time zone and first-pass target in one audited step, and refiles
 * the motors already counted under the new days and shifts in the same transaction.
 */
export async function changeShiftCalendar(db: Knex, body: ShiftCalendarBody, actor: Actor, now = new Date()) {
  const codes = body.shifts.map((s) => s.code);
  const starts = body.shifts.map((s) => minutesOf(s.startsAt));
  const fields = [
    ...codes.flatMap((c, i) => (codes.indexOf(c) !== i ? [{ field: `shifts[${i}].code`, message: `code ${c} is given twice` }] : [])),
    ...starts.flatMap((m, i) => (starts.indexOf(m) !== i ? [{ field: `shifts[${i}].startsAt`, message: 'two shifts cannot start at the same time' }] : [])),
  ];
  if (fields.length > 0) throw invalid(fields);
  return db.transaction(async (trx) => {
    const before = presentCalendar(await readShiftCalendar(trx));
    await trx('plant_shifts').delete();
    await trx('plant_shifts').insert(body.shifts.map((s) => ({ code: s.code, name: s.name, starts_minute: minutesOf(s.startsAt) })));
    await trx('yield_settings')
      .insert({ id: 1, time_zone: body.timeZone, first_pass_target: body.firstPassTarget, updated_by: actor.name, updated_at: now })
      .onConflict('id').merge();
    const calendar = await readShiftCalendar(trx);
    await refileYieldRollups(trx, calendar);
    const after = presentCalendar(calendar);
    await recordAudit(trx, { actor, action: 'shift_calendar.changed', entityType: 'shift_calendar', entityId: 'plant', before, after, reason: body.reason, at: now });
    return after;
  });
}
