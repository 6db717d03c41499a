import type { Knex } from 'knex';
import { runStatements, type Statement } from '../../db/statements.js';
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

type CalendarRow = { time_zone: string | null; first_pass_target: number | null; code: string | null; name: string | null; starts_minute: number | null };

/** The calendar in force in one query (ingest reads it in every batch): the settings beside each shift. */
export const shiftCalendarStatement: Statement = {
  sql: `SELECT settings.time_zone, settings.first_pass_target, shifts.code, shifts.name, shifts.starts_minute
          FROM (SELECT 1 AS one) AS base
          LEFT JOIN yield_settings AS settings ON settings.id = 1
          LEFT JOIN plant_shifts AS shifts ON TRUE
         ORDER BY shifts.starts_minute`,
  bindings: [],
};

/** The calendar from that query's rows; the defaults where nothing is set. */
export function shiftCalendarFromRows(rows: readonly CalendarRow[]): ShiftCalendar {
  const shifts = rows.filter((row) => row.code !== null);
  return {
    timeZone: rows[0]?.time_zone ?? defaultShiftCalendar.timeZone,
    firstPassTarget: rows[0]?.first_pass_target ?? defaultShiftCalendar.firstPassTarget,
    shifts: shifts.length > 0
      ? shifts.map((s) => ({ code: s.code as string, name: s.name as string, startsMinute: s.starts_minute as number }))
      : defaultShiftCalendar.shifts,
  };
}

export async function readShiftCalendar(db: Knex): Promise<ShiftCalendar> {
  const [rows] = await runStatements(db, [shiftCalendarStatement]);
  return shiftCalendarFromRows(rows as CalendarRow[]);
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
