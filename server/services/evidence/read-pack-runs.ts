import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import { packRuns } from './pack-scope.js';

export type PackMeasurement = {
  characteristicId: number; code: string; unit: string;
  value: number; lsl: number | null; usl: number | null; verdict: string;
};

export type PackRun = {
  id: number; uuid: string; serial: string; lot: string; product: string; attempt: number;
  startedAt: Date; station: string; calibrationDue: Date; calibrationOk: boolean;
  operatorBadge: string; programVersion: string; limitRevision: number | null; verdict: string;
  measurements: PackMeasurement[];
};

type RunRow = {
  id: number | string; run_uuid: string; serial: string; lot: string; product: string; attempt: number;
  started_at: Date; station: string; calibration_due: Date; calibration_ok: number | boolean;
  operator_badge: string; program_version: string; revision: number | null; verdict: string;
};

type MeasurementRow = {
  run_id: number | string; characteristic_id: number;
  value: number; lsl: number | null; usl: number | null; verdict: string;
};

type CharacteristicFacts = { code: string; unit: string; sortOrder: number };

async function characteristicsById(db: Knex): Promise<Map<number, CharacteristicFacts>> {
  const rows = (await db('characteristics').select('id', 'code', 'unit', 'sort_order')) as Array<{ id: number; code: string; unit: string; sort_order: number }>;
  return new Map(rows.map((c) => [Number(c.id), { code: c.code, unit: c.unit, sortOrder: Number(c.sort_order) }]));
}

/**
 * The pack's run ids in order, read once. Paging the filtered join itself ("id > last ORDER BY id
 * LIMIT n") makes MariaDB join and sort the whole filtered set for every page; a list of ids
 * (8 bytes a run) lets each page fetch its rows by primary key instead.
 */
async function packRunIds(db: Knex, filter: PackFilter, productId: number | undefined): Promise<number[]> {
  const q = packRuns(db, filter).orderBy('r.id').select('r.id');
  if (productId !== undefined) q.where('m.product_id', productId);
  return ((await q) as Array<{ id: number | string }>).map((row) => Number(row.id));
}

/**
 * Visits the pack's runs in id order, one page at a time with their measurements, so memory
 * stays flat however large the pack is (beyond the list of run ids). `visit` may throw to stop
 * (cancellation).
 */
export async function eachRunPage(
  db: Knex,
  filter: PackFilter,
  options: { productId?: number; pageSize?: number },
  visit: (runs: PackRun[]) => Promise<void>,
): Promise<void> {
  const pageSize = options.pageSize ?? 500;
  const allIds = await packRunIds(db, filter, options.productId);
  const characteristics = await characteristicsById(db);
  // Test-plan order: sort_order, then id.
  const order = (id: number) => { const c = characteristics.get(id); return c ? c.sortOrder * 1e9 + id : id; };
  for (let start = 0; start < allIds.length; start += pageSize) {
    const pageIds = allIds.slice(start, start + pageSize);
    const rows = (await db({ r: 'test_runs' })
      .join({ m: 'motors' }, 'm.id', 'r.motor_id')
      .join({ l: 'lots' }, 'l.id', 'm.lot_id')
      .join({ p: 'products' }, 'p.id', 'm.product_id')
      .join({ s: 'stations' }, 's.id', 'r.station_id')
      .leftJoin({ ls: 'limit_sets' }, 'ls.id', 'r.limit_set_id')
      .whereIn('r.id', pageIds)
      .orderBy('r.id')
      .select(
        'r.id', 'r.run_uuid', 'm.serial', { lot: 'l.code' }, { product: 'p.code' }, 'r.attempt', 'r.started_at',
        { station: 's.code' }, 'r.calibration_due', 'r.calibration_ok', 'r.operator_badge', 'r.program_version',
        'ls.revision', 'r.verdict',
      )) as RunRow[];
    // By primary key only: joined with characteristics, MariaDB drives from that small table and
    // walks each characteristic's whole series in the (characteristic_id, run_id) index instead.
    const measured = (await db('measurements').whereIn('run_id', pageIds)
      .select('run_id', 'characteristic_id', 'value', 'lsl', 'usl', 'verdict')) as MeasurementRow[];
    const byRun = new Map<number, PackMeasurement[]>();
    for (const m of measured) {
      const characteristic = characteristics.get(Number(m.characteristic_id));
      if (!characteristic) throw new Error(`measurement of unknown characteristic ${m.characteristic_id}`);
      const list = byRun.get(Number(m.run_id)) ?? [];
      list.push({ characteristicId: Number(m.characteristic_id), code: characteristic.code, unit: characteristic.unit, value: Number(m.value), lsl: m.lsl, usl: m.usl, verdict: m.verdict });
      byRun.set(Number(m.run_id), list);
    }
    for (const list of byRun.values()) list.sort((a, b) => order(a.characteristicId) - order(b.characteristicId));
    await visit(rows.map((row) => ({
      id: Number(row.id), uuid: row.run_uuid, serial: row.serial, lot: row.lot, product: row.product,
      attempt: Number(row.attempt), startedAt: new Date(row.started_at), station: row.station,
      calibrationDue: new Date(row.calibration_due), calibrationOk: Boolean(row.calibration_ok),
      operatorBadge: row.operator_badge, programVersion: row.program_version,
      limitRevision: row.revision === null ? null : Number(row.revision), verdict: row.verdict,
      measurements: byRun.get(Number(row.id)) ?? [],
    })));
  }
}
