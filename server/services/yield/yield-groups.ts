import type { Knex } from 'knex';
import { finalYield, firstPassYield } from '../../analysis/yield/index.js';
import { isoWeekOf } from './plant-time.js';
import { whereFilter, type ResolvedFilter, type YieldGrouping } from './yield-filter.js';

export type Counts = { tested: number; passedFirst: number; passedFinal: number };
export type YieldGroup = Counts & { key: string; firstPassYield: number | null; finalYield: number | null };

type CountRow = { k: string | number | Date; s?: string; tested: string | number; passed_first: string | number; passed_final: string | number };

// Columns of yield_counts that a grouping reads, and where codes are looked up for the keys.
const columnsOf: Record<YieldGrouping, string[]> = {
  day: ['shift_day'], week: ['shift_day'], shift: ['shift_day', 'shift_code'],
  line: ['line'], station: ['station_id'], product: ['product_id'], lot: ['lot_id'],
};
const codeTable = { station: 'stations', product: 'products', lot: 'lots' } as const;

function countsOf(row: CountRow): Counts {
  // SUM comes back from MariaDB as DECIMAL, which mysql2 hands over as text.
  return { tested: Number(row.tested), passedFirst: Number(row.passed_first), passedFinal: Number(row.passed_final) };
}

export function withYields(key: string, counts: Counts): YieldGroup {
  return { key, ...counts, firstPassYield: firstPassYield(counts), finalYield: finalYield(counts) };
}

/** Sums of the per-shift counts, grouped by the given columns (none: one total row). */
export function countQuery(db: Knex, filter: ResolvedFilter, columns: string[]) {
  const [first, second] = columns.map((c) => `c.${c}`);
  const keys = [first ? db.raw('?? AS k', [first]) : null, second ? db.raw('?? AS s', [second]) : null].filter((k) => k !== null);
  const query = whereFilter(db('yield_counts as c'), filter, 'c')
    .select<CountRow[]>(...keys, db.raw('SUM(c.tested) AS tested'), db.raw('SUM(c.passed_first) AS passed_first'), db.raw('SUM(c.passed_final) AS passed_final'));
  return columns.length > 0 ? query.groupBy(columns.map((c) => `c.${c}`)) : query;
}

const dayOf = (value: CountRow['k']) => (value instanceof Date ? value.toISOString().slice(0, 10) : String(value));

/** Tested, passed-first and passed-final motors per group, from the per-shift counts. */
export async function countYieldGroups(db: Knex, filter: ResolvedFilter, groupBy: YieldGrouping): Promise<YieldGroup[]> {
  const rows = await countQuery(db, filter, columnsOf[groupBy]);
  if (groupBy === 'day' || groupBy === 'week' || groupBy === 'shift') {
    const keyOf = (row: CountRow) => (groupBy === 'day' ? dayOf(row.k) : groupBy === 'week' ? isoWeekOf(dayOf(row.k)) : `${dayOf(row.k)}/${row.s}`);
    const folded = new Map<string, Counts>();
    for (const row of rows) {
      const counts = countsOf(row);
      const sum = folded.get(keyOf(row)) ?? { tested: 0, passedFirst: 0, passedFinal: 0 };
      folded.set(keyOf(row), { tested: sum.tested + counts.tested, passedFirst: sum.passedFirst + counts.passedFirst, passedFinal: sum.passedFinal + counts.passedFinal });
    }
    return [...folded].sort(([a], [b]) => (a < b ? -1 : 1)).map(([key, counts]) => withYields(key, counts));
  }
  const codes = groupBy === 'line' ? null : await codesOf(db, codeTable[groupBy], rows.map((r) => Number(r.k)));
  return rows
    .map((row) => withYields(codes ? codes.get(Number(row.k)) ?? `#${String(row.k)}` : String(row.k), countsOf(row)))
    .sort((a, b) => a.key.localeCompare(b.key));
}

async function codesOf(db: Knex, table: string, ids: number[]): Promise<Map<number, string>> {
  if (ids.length === 0) return new Map();
  const rows: Array<{ id: number; code: string }> = await db(table).whereIn('id', ids).select('id', 'code');
  return new Map(rows.map((r) => [r.id, r.code]));
}
