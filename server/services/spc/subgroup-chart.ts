import type { Knex } from 'knex';
import { runRangeOf } from './series.js';

/**
 * The lot subgroup chart: mean and standard deviation of each lot, aggregated by MariaDB. The
 * latest 500 lots at most, in the order their first run was received.
 */
export async function lotSubgroups(db: Knex, characteristicId: number, window: { from?: Date; to?: Date }) {
  const range = await runRangeOf(db, window);
  const rows: Array<{ lot: string; n: number; mean: number; sd: number | null; first_run: number }> = await db('measurements as m')
    .join('test_runs as r', 'r.id', 'm.run_id').join('lots as l', 'l.id', 'r.lot_id')
    .where('m.characteristic_id', characteristicId).whereBetween('m.run_id', [range.fromRunId, range.toRunId])
    .groupBy('r.lot_id', 'l.code')
    .orderBy('first_run', 'desc').limit(500)
    .select('l.code as lot', db.raw('COUNT(*) AS n, AVG(m.value) AS mean, STDDEV_SAMP(m.value) AS sd, MIN(m.run_id) AS first_run'));
  return rows.reverse().map((r) => ({ lot: r.lot, n: Number(r.n), mean: Number(r.mean), sd: r.sd === null ? null : Number(r.sd), firstRunId: Number(r.first_run) }));
}
