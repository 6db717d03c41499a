import type { Knex } from 'knex';
import { whereFilter, type ResolvedFilter } from './yield-filter.js';

export type ParetoEntry = { characteristic: string; name: string; failures: number; share: number };

/**
 * Failing measurements on first attempts per characteristic, most first, with each one's share of
 * all such failures. Characteristics of different products that share a code are one bar, since a
 * code names the same test on every product of the plant.
 */
export async function countFirstFailures(db: Knex, filter: ResolvedFilter): Promise<ParetoEntry[]> {
  const rows = await whereFilter(db('yield_first_failures as f'), filter, 'f')
    .join('characteristics as c', 'c.id', 'f.characteristic_id')
    .select<Array<{ code: string; name: string; failures: number }>>('c.code', db.raw('MIN(c.name) AS name'), db.raw('COUNT(*) AS failures'))
    .groupBy('c.code')
    .orderBy([{ column: 'failures', order: 'desc' }, { column: 'c.code', order: 'asc' }]);
  const total = rows.reduce((sum, row) => sum + Number(row.failures), 0);
  return rows.map((row) => ({ characteristic: row.code, name: row.name, failures: Number(row.failures), share: Number(row.failures) / total }));
}
