import type { Knex } from 'knex';
import { offsetMinutes } from './plant-time.js';

export type Shift = { code: string; name: string; startsMinute: number };
export type ShiftCalendar = { timeZone: string; firstPassTarget: number; shifts: Shift[] };

/** Until Setup says otherwise: three eight-hour shifts from 06:00, plant time UTC, target 95 %. */
export const defaultShiftCalendar: ShiftCalendar = {
  timeZone: 'UTC',
  firstPassTarget: 0.95,
  shifts: [
    { code: 'early', name: 'Early (06–14)', startsMinute: 360 },
    { code: 'late', name: 'Late (14–22)', startsMinute: 840 },
    { code: 'night', name: 'Night (22–06)', startsMinute: 1320 },
  ],
};

export async function readShiftCalendar(db: Knex): Promise<ShiftCalendar> {
  const [settings, shifts] = await Promise.all([
    db('yield_settings').where({ id: 1 }).first('time_zone', 'first_pass_target'),
    db('plant_shifts').orderBy('starts_minute').select('code', 'name', 'starts_minute'),
  ]);
  return {
    timeZone: settings?.time_zone ?? defaultShiftCalendar.timeZone,
    firstPassTarget: settings?.first_pass_target ?? defaultShiftCalendar.firstPassTarget,
    shifts: shifts.length > 0
      ? shifts.map((s: { code: string; name: string; starts_minute: number }) => ({ code: s.code, name: s.name, startsMinute: s.starts_minute }))
      : defaultShiftCalendar.shifts,
  };
}

export const shiftsInOrder = (calendar: ShiftCalendar) => [...calendar.shifts].sort((a, b) => a.startsMinute - b.startsMinute);

/** Where a moment falls in the plant's calendar: its production day and the code of its shift. */
export type PlantSlot = { day: string; shift: string };

/**
 * The production day starts with the earliest shift, so a night shift running past midnight
 * belongs to the day it started; a shift runs until the next one starts.
 * The SQL in recompute-shift-slots.ts files stored motors by the same rule.
 */
export function slotOf(calendar: ShiftCalendar, at: Date): PlantSlot {
  const starts = shiftsInOrder(calendar);
  const plantMinutes = Math.floor(at.getTime() / 60_000) + offsetMinutes(calendar.timeZone, at.getTime());
  const day = new Date((plantMinutes - starts[0].startsMinute) * 60_000).toISOString().slice(0, 10);
  const minuteOfDay = ((plantMinutes % 1440) + 1440) % 1440;
  const shift = [...starts].reverse().find((s) => s.startsMinute <= minuteOfDay) ?? starts[starts.length - 1];
  return { day, shift: shift.code };
}
