import type { Knex } from 'knex';

// The plant-scale data set: one product with 40 characteristics, 250 lots × 1,000 motors,
// one first-attempt run each → 250,000 motors, 250,000 runs and 10,000,000 measurements.
export const benchScale = { lots: 250, motorsPerLot: 1000, characteristics: 40, stations: 16 } as const;
export const benchProductCode = 'BENCH-PM';
const datasetVersion = 'v1-250k-10M';

export type BenchDataset = { productId: number; characteristicIds: number[]; stationIds: number[]; limitSetId: number; motors: number };

function prng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function benchSerial(lot: number, index: number): string {
  return `BX${String(lot).padStart(3, '0')}-${String(index).padStart(5, '0')}`;
}

export function benchCharacteristicCode(i: number): string {
  return `C${String(i + 1).padStart(2, '0')}`;
}

export async function loadBenchDataset(db: Knex): Promise<BenchDataset | null> {
  const marker = await db('app_meta').where({ meta_key: 'bench_dataset' }).first();
  if (marker?.meta_value !== datasetVersion) return null;
  const product = await db('products').where({ code: benchProductCode }).first();
  const characteristics = await db('characteristics').where({ product_id: product.id }).orderBy('sort_order');
  const stations = await db('stations').where('code', 'like', 'BENCH-%').orderBy('id');
  const limitSet = await db('limit_sets').where({ product_id: product.id, status: 'approved' }).first();
  const motors = await db('motors').where({ product_id: product.id }).count({ n: '*' }).first();
  return { productId: product.id, characteristicIds: characteristics.map((c) => c.id), stationIds: stations.map((s) => s.id), limitSetId: limitSet.id, motors: Number(motors?.n ?? 0) };
}

/** Builds the set once (about a minute or two on 2 cores); later runs reuse it. */
export async function ensureBenchDataset(db: Knex, log: (line: string) => void): Promise<BenchDataset> {
  const existing = await loadBenchDataset(db);
  if (existing) return existing;
  log('generating the plant-scale data set (250k motors, 10M measurements)…');
  const now = new Date();
  const [productId] = await db('products').insert({
    code: benchProductCode, name: 'Benchmark traction motor', motor_kind: 'pmsm', pole_pairs: 4, resolver_pole_pairs: 4,
    rated_voltage_v: 350, rated_power_kw: 150, rated_speed_rpm: 12000, winding_material: 'copper', winding_type: 'random',
    insulation_class: 'H', serial_pattern: '^BX[0-9]{3}-[0-9]{5}$', created_at: now,
  });
  await db('characteristics').insert(Array.from({ length: benchScale.characteristics }, (_, i) => ({
    product_id: productId, code: benchCharacteristicCode(i), name: `Characteristic ${i + 1}`, unit: 'V',
    test_step: 'bench', spc_enabled: i < 4, subgroup_mode: 'individual', derived: false, sort_order: i,
  })));
  const characteristicIds = (await db('characteristics').where({ product_id: productId }).orderBy('sort_order')).map((c) => c.id as number);
  const effectiveFrom = new Date(now.getTime() - 400 * 86_400_000);
  const [limitSetId] = await db('limit_sets').insert({
    product_id: productId, revision: 1, status: 'approved', effective_from: effectiveFrom, authored_by: 'quality',
    authored_by_name: 'bench', authored_at: effectiveFrom, approved_by: 'quality2', approved_by_name: 'bench', approved_at: effectiveFrom,
  });
  await db('limits').insert(characteristicIds.map((id) => ({ limit_set_id: limitSetId, characteristic_id: id, lsl: 90, nominal: 100, usl: 110 })));
  await db('stations').insert(Array.from({ length: benchScale.stations }, (_, i) => ({
    code: `BENCH-S${String(i + 1).padStart(2, '0')}`, line: i < 8 ? 'A' : 'B', kind: 'eol', name: `Bench stand ${i + 1}`,
    calibration_due: new Date(now.getTime() + 365 * 86_400_000),
  })));
  const stationIds = (await db('stations').where('code', 'like', 'BENCH-%').orderBy('id')).map((s) => s.id as number);
  const random = prng(42);
  const yearStart = now.getTime() - 365 * 86_400_000;
  const msPerMotor = (365 * 86_400_000) / (benchScale.lots * benchScale.motorsPerLot);
  for (let lot = 0; lot < benchScale.lots; lot++) {
    const [lotId] = await db('lots').insert({ code: `BL-${String(lot).padStart(3, '0')}`, product_id: productId, created_at: new Date(yearStart + lot * benchScale.motorsPerLot * msPerMotor) });
    await insertLot(db, { lot, lotId: Number(lotId), productId: Number(productId), limitSetId: Number(limitSetId), characteristicIds, stationIds, random, yearStart, msPerMotor });
    if (lot % 25 === 24) log(`  ${(lot + 1) * benchScale.motorsPerLot} motors`);
  }
  await db('app_meta').insert({ meta_key: 'bench_dataset', meta_value: datasetVersion, updated_at: new Date() });
  return { productId: Number(productId), characteristicIds, stationIds, limitSetId: Number(limitSetId), motors: benchScale.lots * benchScale.motorsPerLot };
}

type LotContext = {
  lot: number; lotId: number; productId: number; limitSetId: number; characteristicIds: number[]; stationIds: number[];
  random: () => number; yearStart: number; msPerMotor: number;
};

async function insertLot(db: Knex, c: LotContext): Promise<void> {
  const motors = Array.from({ length: benchScale.motorsPerLot }, (_, i) => {
    const at = new Date(c.yearStart + (c.lot * benchScale.motorsPerLot + i) * c.msPerMotor);
    return { serial: benchSerial(c.lot, i), product_id: c.productId, lot_id: c.lotId, status: 'passed', attempts: 1, last_station_id: c.stationIds[i % c.stationIds.length], last_tested_at: at, created_at: at };
  });
  await db.batchInsert('motors', motors, 1000);
  const motorRows = await db('motors').where({ lot_id: c.lotId }).select('id', 'serial', 'last_tested_at', 'last_station_id').orderBy('id');
  const runs = motorRows.map((m, i) => ({
    run_uuid: `00000000-0000-4000-8000-${String(c.lot * benchScale.motorsPerLot + i).padStart(12, '0')}`,
    motor_id: m.id, station_id: m.last_station_id, lot_id: c.lotId, attempt: 1, started_at: m.last_tested_at,
    finished_at: new Date(new Date(m.last_tested_at).getTime() + 180_000), operator_badge: 'B-0001', program_version: 'bench-1',
    limit_set_id: c.limitSetId, verdict: 'pass', calibration_ok: true, calibration_due: '2099-01-01', body_sha256: '0'.repeat(64),
    response_json: '{}', source: 'station', received_at: m.last_tested_at,
  }));
  await db.batchInsert('test_runs', runs, 1000);
  const runRows = await db('test_runs').where({ lot_id: c.lotId }).select('id', 'motor_id').orderBy('id');
  const byMotor = new Map(runRows.map((r) => [r.motor_id, r.id]));
  await db.raw('UPDATE motors m JOIN test_runs r ON r.motor_id = m.id SET m.latest_run_id = r.id WHERE m.lot_id = ?', [c.lotId]);
  const rows: Array<Array<string | number>> = [];
  for (const motor of motorRows) {
    const runId = byMotor.get(motor.id);
    for (const characteristicId of c.characteristicIds) {
      const value = 100 + (c.random() + c.random() + c.random() - 1.5) * 4;
      rows.push([runId, characteristicId, Math.round(value * 1000) / 1000, 90, 110, 'pass']);
    }
  }
  for (let i = 0; i < rows.length; i += 8000) {
    const chunk = rows.slice(i, i + 8000);
    await db.raw(`INSERT INTO measurements (run_id, characteristic_id, value, lsl, usl, verdict) VALUES ${chunk.map(() => '(?,?,?,?,?,?)').join(',')}`, chunk.flat());
  }
}
