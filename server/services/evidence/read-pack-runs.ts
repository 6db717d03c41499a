import type { Knex } from 'knex';
import type { Connection } from 'mysql2';
import { preparedRows, withConnection } from '../../db/prepared-rows.js';
import type { PackFilter } from './pack-filter.js';
import { packRuns } from './pack-scope.js';
import { eachPageReadAhead } from './read-ahead.js';

/** One stored result as the database returns it, in select order. */
export type MeasurementRow = [runId: number, characteristicId: number, value: number, lsl: number | null, usl: number | null, verdict: string];

export type PackRun = {
  id: number; uuid: string; serial: string; attempt: number; startedAt: Date; station: string;
  calibrationDue: Date; operatorBadge: string; programVersion: string; limitRevision: number | null; verdict: string;
  /** In characteristic id order, as stored. */
  measurements: MeasurementRow[];
};

type RunRow = {
  id: number | string; run_uuid: string; serial: string; attempt: number; started_at: Date; station: string;
  calibration_due: Date; operator_badge: string; program_version: string; revision: number | null; verdict: string;
};

type Page = { runs: RunRow[]; measured: MeasurementRow[] };

/**
 * The pack's run ids in order, read once. Paging the filtered join itself ("id > last ORDER BY id
 * LIMIT n") makes MariaDB join and sort the whole filtered set for every page; a list of ids
 * (8 bytes a run) lets each page fetch its rows by primary key instead.
 */
async function packRunIds(db: Knex, filter: PackFilter, productId: number): Promise<number[]> {
  const q = packRuns(db, filter).where('m.product_id', productId).orderBy('r.id').select('r.id');
  return ((await q) as Array<{ id: number | string }>).map((row) => Number(row.id));
}

function readRuns(db: Knex, ids: number[]): Promise<RunRow[]> {
  return db({ r: 'test_runs' })
    .join({ m: 'motors' }, 'm.id', 'r.motor_id')
    .join({ s: 'stations' }, 's.id', 'r.station_id')
    .leftJoin({ ls: 'limit_sets' }, 'ls.id', 'r.limit_set_id')
    .whereIn('r.id', ids)
    .orderBy('r.id')
    .select('r.id', 'r.run_uuid', 'm.serial', 'r.attempt', 'r.started_at', { station: 's.code' }, 'r.calibration_due',
      'r.operator_badge', 'r.program_version', 'ls.revision', 'r.verdict')
    .then((rows: RunRow[]) => rows);
}

// By primary key only: joined with characteristics, MariaDB drives from that small table and
// walks each characteristic's whole series in the (characteristic_id, run_id) index instead.
function readMeasurements(connection: Connection, ids: number[]): Promise<MeasurementRow[]> {
  return preparedRows<MeasurementRow>(connection, `SELECT run_id, characteristic_id, value, lsl, usl, verdict FROM measurements
    WHERE run_id IN (${ids.map(() => '?').join(',')}) ORDER BY run_id, characteristic_id`, ids);
}

function toRuns({ runs, measured }: Page): PackRun[] {
  const byRun = new Map<number, MeasurementRow[]>();
  for (const m of measured) {
    const runId = Number(m[0]);
    const list = byRun.get(runId);
    if (list) list.push(m);
    else byRun.set(runId, [m]);
  }
  return runs.map((row) => ({
    id: Number(row.id), uuid: row.run_uuid, serial: row.serial, attempt: Number(row.attempt), startedAt: new Date(row.started_at),
    station: row.station, calibrationDue: new Date(row.calibration_due), operatorBadge: row.operator_badge,
    programVersion: row.program_version, limitRevision: row.revision === null ? null : Number(row.revision), verdict: row.verdict,
    measurements: byRun.get(Number(row.id)) ?? [],
  }));
}

/**
 * Visits one product's runs in the pack in id order, a page at a time with their measurements,
 * so memory stays flat however large the pack is (beyond the list of run ids). The next page is
 * read while `visit` works on this one. `visit` may throw to stop (cancellation).
 */
export async function eachRunPage(
  db: Knex,
  filter: PackFilter,
  options: { productId: number; pageSize?: number },
  visit: (runs: PackRun[]) => Promise<void>,
): Promise<void> {
  const pageSize = options.pageSize ?? 500;
  const allIds = await packRunIds(db, filter, options.productId);
  await withConnection(db, (connection) => eachPageReadAhead(Math.ceil(allIds.length / pageSize), async (page) => {
    const ids = allIds.slice(page * pageSize, (page + 1) * pageSize);
    // Both settle before a failure is passed on, so no query is still running on the lent connection.
    const [runs, measured] = await Promise.allSettled([readRuns(db, ids), readMeasurements(connection, ids)]);
    if (runs.status === 'rejected') throw runs.reason;
    if (measured.status === 'rejected') throw measured.reason;
    return toRuns({ runs: runs.value, measured: measured.value });
  }, visit));
}
