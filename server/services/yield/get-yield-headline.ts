import type { Knex } from 'knex';
import { isoWeekOf, mondayOfIsoWeek } from './plant-time.js';
import { readShiftCalendar, slotOf } from './shift-calendar.js';
import { resolveYieldFilter, type ResolvedFilter } from './yield-filter.js';
import { countQuery, withYields, type YieldGroup } from './yield-groups.js';

export type YieldHeadline = {
  today: YieldGroup; week: YieldGroup; motorsOnHold: number; openSignals: number | null;
  firstPassTarget: number; timeZone: string;
};

async function totalsOf(db: Knex, key: string, filter: ResolvedFilter): Promise<YieldGroup> {
  const [row] = await countQuery(db, filter, []);
  return withYields(key, { tested: Number(row?.tested ?? 0), passedFirst: Number(row?.passed_first ?? 0), passedFinal: Number(row?.passed_final ?? 0) });
}

async function countMotorsOnHold(db: Knex, filter: ResolvedFilter): Promise<number> {
  const query = db('motors as m').where('m.status', 'on hold');
  if (filter.productId !== undefined) query.where('m.product_id', filter.productId);
  if (filter.line !== undefined) query.join('yield_motors as y', 'y.motor_id', 'm.id').where('y.line', filter.line);
  const row = await query.count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

// The signals table belongs to SPC; a plant that has not migrated it yet simply has no count.
async function countOpenSignals(db: Knex, filter: ResolvedFilter): Promise<number | null> {
  if (!(await db.schema.hasTable('signals'))) return null;
  const query = db('signals').where({ status: 'open' });
  if (filter.productId !== undefined) query.where('product_id', filter.productId);
  const row = await query.count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/**
 * The board's tiles: today's and this week's yields (production day and ISO week in plant time),
 * the motors on hold now and the open SPC signals, for a product and/or line.
 */
export async function getYieldHeadline(db: Knex, input: { product?: string; line?: string }, now = new Date()): Promise<YieldHeadline> {
  const calendar = await readShiftCalendar(db);
  const today = slotOf(calendar, now).day;
  const monday = mondayOfIsoWeek(isoWeekOf(today)) ?? today;
  const [todayFilter, weekFilter] = await Promise.all([
    resolveYieldFilter(db, calendar, { ...input, from: today, to: today }, now),
    resolveYieldFilter(db, calendar, { ...input, from: monday, to: today }, now),
  ]);
  const [todayTotals, weekTotals, motorsOnHold, openSignals] = await Promise.all([
    totalsOf(db, today, todayFilter), totalsOf(db, isoWeekOf(today), weekFilter),
    countMotorsOnHold(db, todayFilter), countOpenSignals(db, todayFilter),
  ]);
  return { today: todayTotals, week: weekTotals, motorsOnHold, openSignals, firstPassTarget: calendar.firstPassTarget, timeZone: calendar.timeZone };
}
