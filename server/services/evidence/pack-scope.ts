import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';

// Which motors and runs a pack covers, as query fragments over the aliases
// m (motors), l (lots), p (products) and r (test_runs), shared by every sheet and the CSV so
// they can never disagree about what is in the pack.

function runWindow(filter: PackFilter, q: Knex.QueryBuilder, alias = 'r'): Knex.QueryBuilder {
  if (filter.from) q.where(`${alias}.started_at`, '>=', new Date(filter.from));
  if (filter.to) q.where(`${alias}.started_at`, '<', new Date(filter.to));
  return q;
}

/** motors m ⋈ lots l ⋈ products p, narrowed to the pack's motors. */
export function packMotors(db: Knex, filter: PackFilter): Knex.QueryBuilder {
  const q = db({ m: 'motors' }).join({ l: 'lots' }, 'l.id', 'm.lot_id').join({ p: 'products' }, 'p.id', 'm.product_id');
  if (filter.serials) q.whereIn('m.serial', filter.serials);
  if (filter.serialFrom && filter.serialTo) q.whereBetween('m.serial', [filter.serialFrom, filter.serialTo]);
  if (filter.lots) q.whereIn('l.code', filter.lots);
  if (filter.product) q.where('p.code', filter.product);
  if (filter.from || filter.to) {
    // A date range means "motors tested in that window", and only those runs are shown.
    q.whereExists(function windowed(this: Knex.QueryBuilder) {
      runWindow(filter, this.select(db.raw('1')).from({ w: 'test_runs' }).whereRaw('w.motor_id = m.id'), 'w');
    });
  }
  return q;
}

/**
 * The pack's serials in order, read once. Paging the filtered join by "serial > last LIMIT n"
 * makes MariaDB join and sort the whole filtered set again for every page.
 */
export async function packSerials(db: Knex, filter: PackFilter): Promise<string[]> {
  return ((await packMotors(db, filter).orderBy('m.serial').select('m.serial')) as Array<{ serial: string }>).map((r) => r.serial);
}

/** The pack's runs: test_runs r joined to the pack's motors (and their lot and product). */
export function packRuns(db: Knex, filter: PackFilter): Knex.QueryBuilder {
  return runWindow(filter, packMotors(db, filter).join({ r: 'test_runs' }, 'r.motor_id', 'm.id'));
}

export type PackProduct = { id: number; code: string; name: string };

/** The products of the pack's motors, by code: one Results sheet each. */
export async function packProducts(db: Knex, filter: PackFilter): Promise<PackProduct[]> {
  const rows = (await packMotors(db, filter).distinct('p.id', 'p.code', 'p.name').orderBy('p.code')) as PackProduct[];
  return rows.map((p) => ({ id: Number(p.id), code: p.code, name: p.name }));
}

export type PackTotals = {
  motors: number;
  runs: number;
  measurements: number;
  motorStatus: Record<string, number>;
  runVerdicts: Record<string, number>;
  products: PackProduct[];
  /** Ids of the stations and of the limit revisions behind the pack's runs. */
  stationIds: number[];
  limitSetIds: number[];
};

/**
 * Counted once: drives the progress bar and fills the Summary sheet and the manifest. The queries
 * are independent and run side by side on their own connections.
 */
export async function countPack(db: Knex, filter: PackFilter): Promise<PackTotals> {
  const [statusRows, runRows, measured, products] = await Promise.all([
    packMotors(db, filter).groupBy('m.status').select('m.status').count({ n: '*' }) as Promise<Array<{ status: string; n: number }>>,
    packRuns(db, filter).groupBy('r.verdict', 'r.station_id', 'r.limit_set_id').select('r.verdict', 'r.station_id', 'r.limit_set_id')
      .count({ n: '*' }) as Promise<Array<{ verdict: string; station_id: number; limit_set_id: number | null; n: number }>>,
    packRuns(db, filter).join({ ms: 'measurements' }, 'ms.run_id', 'r.id').count({ n: '*' }).first() as Promise<{ n: number } | undefined>,
    packProducts(db, filter),
  ]);
  const motorStatus = Object.fromEntries(statusRows.map((row) => [row.status, Number(row.n)]));
  const runVerdicts: Record<string, number> = {};
  for (const row of runRows) runVerdicts[row.verdict] = (runVerdicts[row.verdict] ?? 0) + Number(row.n);
  return {
    motors: Object.values(motorStatus).reduce((a, b) => a + b, 0),
    runs: Object.values(runVerdicts).reduce((a, b) => a + b, 0),
    measurements: Number(measured?.n ?? 0),
    motorStatus,
    runVerdicts,
    products,
    stationIds: [...new Set(runRows.map((row) => Number(row.station_id)))],
    limitSetIds: [...new Set(runRows.filter((row) => row.limit_set_id !== null).map((row) => Number(row.limit_set_id)))],
  };
}
