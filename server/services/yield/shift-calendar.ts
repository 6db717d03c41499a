import type { Knex } from 'knex';
import { addDays, isoWeekOf, offsetReader, utcOfPlantTime } from './plant-time.js';

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

/** Rollups bucket time by UTC quarter hour; shift starts and zone offsets fall on quarter hours. */
export const quarterMs = 15 * 60_000;

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

/** Where a quarter hour falls in the plant's calendar. */
export type PlantSlot = { day: string; week: string; shift: string };

/**
 * Maps UTC quarter-hour buckets to production day, ISO week and shift. The production day starts
 * with the earliest shift, so a night shift running past midnight belongs to the day it started.
 */
export function plantSlotter(calendar: ShiftCalendar): (quarter: number) => PlantSlot {
  const starts = [...calendar.shifts].sort((a, b) => a.startsMinute - b.startsMinute);
  const dayStartMinute = starts[0].startsMinute;
  const offsetAt = offsetReader(calendar.timeZone);
  return (quarter) => {
    const utcMs = quarter * quarterMs;
    const plantMinutes = Math.floor(utcMs / 60_000) + offsetAt(utcMs);
    const day = new Date((plantMinutes - dayStartMinute) * 60_000).toISOString().slice(0, 10);
    const minuteOfDay = ((plantMinutes % 1440) + 1440) % 1440;
    const shift = [...starts].reverse().find((s) => s.startsMinute <= minuteOfDay) ?? starts[starts.length - 1];
    return { day, week: isoWeekOf(day), shift: `${day}/${shift.code}` };
  };
}

/** Quarter-hour range [from, to) of the production days from…to inclusive. */
export function productionDaysRange(calendar: ShiftCalendar, fromDay: string, toDay: string): { fromQuarter: number; toQuarter: number } {
  const dayStartMinute = Math.min(...calendar.shifts.map((s) => s.startsMinute));
  return {
    fromQuarter: Math.floor(utcOfPlantTime(calendar.timeZone, fromDay, dayStartMinute) / quarterMs),
    toQuarter: Math.floor(utcOfPlantTime(calendar.timeZone, addDays(toDay, 1), dayStartMinute) / quarterMs),
  };
}

/** Quarter-hour range of one shift on one production day, or null for an unknown shift code. */
export function shiftRange(calendar: ShiftCalendar, day: string, code: string): { fromQuarter: number; toQuarter: number } | null {
  const starts = [...calendar.shifts].sort((a, b) => a.startsMinute - b.startsMinute);
  const index = starts.findIndex((s) => s.code === code);
  if (index < 0) return null;
  const next = starts[index + 1];
  const endMinute = next ? next.startsMinute : starts[0].startsMinute + 1440;
  return {
    fromQuarter: Math.floor(utcOfPlantTime(calendar.timeZone, day, starts[index].startsMinute) / quarterMs),
    toQuarter: Math.floor(utcOfPlantTime(calendar.timeZone, day, endMinute) / quarterMs),
  };
}

/** The production day the instant belongs to. */
export function productionDayAt(calendar: ShiftCalendar, at: Date): string {
  return plantSlotter(calendar)(Math.floor(at.getTime() / quarterMs)).day;
}
