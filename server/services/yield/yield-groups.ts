import type { Knex } from 'knex';
import { finalYield, firstPassYield } from '../../analysis/yield/index.js';
import { plantSlotter, type ShiftCalendar } from './shift-calendar.js';
import { whereFilter, type ResolvedFilter, type YieldGrouping } from './yield-filter.js';

export type Counts = { tested: number; passedFirst: number; passedFinal: number };
export type YieldGroup = Counts & { key: string; firstPassYield: number | null; finalYield: number | null };

type CountRow = { k: string | number; tested: number; passed_first: string | number; passed_final: string | number };

// Columns that group directly, and where their codes are looked up for the keys.
const columnOf = { line: 'line', station: 'station_id', product: 'product_id', lot: 'lot_id' } as const;
const codeTable = { station: 'stations', product: 'products', lot: 'lots' } as const;

function countsOf(row: CountRow): Counts {
  // SUM over booleans comes back from MariaDB as DECIMAL, which mysql2 hands over as text.
  return { tested: Number(row.tested), passedFirst: Number(row.passed_first), passedFinal: Number(row.passed_final) };
}

export function withYields(key: string, counts: Counts): YieldGroup {
  return { key, ...counts, firstPassYield: firstPassYield(counts), finalYield: finalYield(counts) };
}

export function countQuery(db: Knex, filter: ResolvedFilter, column: string) {
  return whereFilter(db('yield_motors as y'), filter, 'y')
    .select<CountRow[]>(db.raw('?? AS k', [`y.${column}`]), db.raw('COUNT(*) AS tested'),
      db.raw('SUM(y.first_pass) AS passed_first'), db.raw('SUM(y.final_pass) AS passed_final'))
    .groupBy(`y.${column}`);
}

/**
 * Tested, passed-first and passed-final motors per group. Time groupings count per quarter hour in
 * the database and fold the buckets into plant days, weeks or shifts here, so the calendar applies
 * as it stands today without rewriting stored rows.
 */
export async function countYieldGroups(db: Knex, calendar: ShiftCalendar, filter: ResolvedFilter, groupBy: YieldGrouping): Promise<YieldGroup[]> {
  if (groupBy === 'day' || groupBy === 'week' || groupBy === 'shift') {
    const rows = await countQuery(db, filter, 'first_quarter');
    const slotOf = plantSlotter(calendar);
    const folded = new Map<string, Counts>();
    for (const row of rows) {
      const key = slotOf(Number(row.k))[groupBy];
      const counts = countsOf(row);
      const sum = folded.get(key) ?? { tested: 0, passedFirst: 0, passedFinal: 0 };
      folded.set(key, { tested: sum.tested + counts.tested, passedFirst: sum.passedFirst + counts.passedFirst, passedFinal: sum.passedFinal + counts.passedFinal });
    }
    return [...folded].sort(([a], [b]) => (a < b ? -1 : 1)).map(([key, counts]) => withYields(key, counts));
  }
  const rows = await countQuery(db, filter, columnOf[groupBy]);
  const codes = groupBy === 'line' ? null : await codesOf(db, codeTable[groupBy], rows.map((r) => Number(r.k)));
  return rows
    .map((row) => withYields(codes ? codes.get(Number(row.k)) ?? `#${row.k}` : String(row.k), countsOf(row)))
    .sort((a, b) => a.key.localeCompare(b.key));
}

async function codesOf(db: Knex, table: string, ids: number[]): Promise<Map<number, string>> {
  if (ids.length === 0) return new Map();
  const rows: Array<{ id: number; code: string }> = await db(table).whereIn('id', ids).select('id', 'code');
  return new Map(rows.map((r) => [r.id, r.code]));
}
