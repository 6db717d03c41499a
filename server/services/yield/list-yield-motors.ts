import type { Knex } from 'knex';
import { z } from 'zod';
import { invalid } from '../../errors.js';
import { addDays, mondayOfIsoWeek } from './plant-time.js';
import { readShiftCalendar, type ShiftCalendar } from './shift-calendar.js';
import { resolveYieldFilter, whereFilter, yieldFilterFields, yieldGroupings, type ResolvedFilter } from './yield-filter.js';

export const yieldMotorsQuerySchema = z.strictObject({
  ...yieldFilterFields,
  groupBy: z.enum(yieldGroupings).optional(),
  key: z.string().trim().min(1).max(80).optional().describe('a group key from GET /yield; needs groupBy'),
  characteristic: z.string().trim().min(1).max(64).optional().describe('only motors whose first attempt failed this characteristic'),
  outcome: z.enum(['all', 'failed-first', 'failed-final']).default('all'),
  limit: z.coerce.number().int().min(1).max(500).default(200),
}).refine((q) => (q.key === undefined) === (q.groupBy === undefined), { path: ['key'], message: 'give key and groupBy together' })
  .meta({ id: 'YieldMotorsQuery' });
export type YieldMotorsQuery = z.infer<typeof yieldMotorsQuerySchema>;

export type YieldMotor = {
  serial: string; product: string; lot: string; station: string; line: string; firstTestedAt: string;
  firstVerdict: 'pass' | 'fail'; finalVerdict: 'pass' | 'fail'; attempts: number; status: string;
};

const badKey = (message: string) => invalid([{ field: 'key', message }]);

type Days = { fromDay: string; toDay: string; shift?: string };
const isDay = (text: string) => /^\d{4}-\d{2}-\d{2}$/.test(text) && !Number.isNaN(Date.parse(text));

/** The production days (and shift) that a time group key names. */
function daysOfKey(calendar: ShiftCalendar, groupBy: 'day' | 'week' | 'shift', key: string): Days {
  if (groupBy === 'day') {
    if (!isDay(key)) throw badKey('must be a production day YYYY-MM-DD');
    return { fromDay: key, toDay: key };
  }
  if (groupBy === 'week') {
    const monday = mondayOfIsoWeek(key);
    if (!monday) throw badKey('must be an ISO week such as 2026-W49');
    return { fromDay: monday, toDay: addDays(monday, 6) };
  }
  const [day, code] = key.split('/');
  if (!isDay(day) || !calendar.shifts.some((s) => s.code === code)) throw badKey('must be a production day and a shift code, such as 2026-12-01/night');
  return { fromDay: day, toDay: day, shift: code };
}

/** The motors behind one bar of the board: a group, a failing characteristic, or both. */
export async function listYieldMotors(db: Knex, query: YieldMotorsQuery, now = new Date()): Promise<{ motors: YieldMotor[]; total: number }> {
  const calendar = await readShiftCalendar(db);
  const { groupBy, key } = query;
  const byColumn = groupBy && key && !['day', 'week', 'shift'].includes(groupBy) ? { [groupBy]: key } : {};
  let filter: ResolvedFilter = await resolveYieldFilter(db, calendar, { ...query, ...byColumn }, now);
  if ((groupBy === 'day' || groupBy === 'week' || groupBy === 'shift') && key) {
    const days = daysOfKey(calendar, groupBy, key);
    // Both ranges hold: a bar outside the board's dates has no motors.
    filter = { ...filter, fromDay: days.fromDay > filter.fromDay ? days.fromDay : filter.fromDay, toDay: days.toDay < filter.toDay ? days.toDay : filter.toDay, shift: days.shift };
  }
  const base = whereFilter(db('yield_motors as y'), filter, 'y');
  if (query.outcome === 'failed-first') base.where('y.first_pass', false);
  if (query.outcome === 'failed-final') base.where('y.final_pass', false);
  if (query.characteristic) {
    base.whereExists(db('yield_first_failures as f').join('characteristics as c', 'c.id', 'f.characteristic_id')
      .whereRaw('f.motor_id = y.motor_id').where('c.code', query.characteristic));
  }
  const [countRow, rows] = await Promise.all([
    base.clone().count({ n: '*' }).first(),
    base.clone()
      .join('motors as m', 'm.id', 'y.motor_id').join('products as p', 'p.id', 'y.product_id')
      .join('lots as l', 'l.id', 'y.lot_id').join('stations as s', 's.id', 'y.station_id')
      .orderBy([{ column: 'y.first_started_at', order: 'desc' }, { column: 'y.motor_id', order: 'desc' }])
      .limit(query.limit)
      .select('m.serial', 'm.status', 'p.code as product', 'l.code as lot', 's.code as station', 'y.line',
        'y.first_started_at', 'y.first_pass', 'y.final_pass', 'y.attempts'),
  ]);
  return {
    total: Number(countRow?.n ?? 0),
    motors: rows.map((r) => ({
      serial: r.serial, product: r.product, lot: r.lot, station: r.station, line: r.line,
      firstTestedAt: new Date(r.first_started_at).toISOString(),
      firstVerdict: r.first_pass ? 'pass' : 'fail', finalVerdict: r.final_pass ? 'pass' : 'fail',
      attempts: r.attempts, status: r.status,
    })),
  };
}
