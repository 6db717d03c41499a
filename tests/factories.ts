// Test data factories: insert an invented plant (product, characteristics, limit revisions,
// stations bound to client ids, lots) straight into the test database, with overrides.
// Each insert forgets the server's cached reference data, as the setup services do, because the
// API tests run the server in this same process.
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { forgetReferenceData } from '../server/services/runs/reference-data.js';
import type { TestRunDocument } from '../server/schemas/test-run.js';

export type CharacteristicSpec = {
  code: string; name?: string; unit: string; testStep: string; derived?: boolean;
  lsl: number | null; nominal?: number | null; usl: number | null; demoValue: number;
};
export type ProductFixture = { id: number; code: string; serialPrefix: string; characteristics: Array<CharacteristicSpec & { id: number }> };
export type LimitSetFixture = { id: number; revision: number };
export type StationFixture = { id: number; code: string; line: string; clientId: string | null };
export type LotFixture = { id: number; code: string };
export type PlantFixture = { product: ProductFixture; limitSet: LimitSetFixture; station: StationFixture; lot: LotFixture };

/** An invented 85 kW traction PMSM test plan; demoValue passes every limit. */
export const defaultCharacteristics: CharacteristicSpec[] = [
  { code: 'wr.u.r20', unit: 'mΩ', testStep: 'winding-resistance', lsl: 20.5, nominal: 21.0, usl: 21.5, demoValue: 21.02 },
  { code: 'wr.unbalance', unit: '%', testStep: 'winding-resistance', lsl: null, usl: 2, demoValue: 0.4 },
  { code: 'ir.r40', unit: 'MΩ', testStep: 'insulation', lsl: 100, usl: null, demoValue: 850 },
  { code: 'hipot.leakage', unit: 'mA', testStep: 'hipot', lsl: null, usl: 5, demoValue: 1.2 },
  { code: 'bemf.ke', unit: 'V/krpm', testStep: 'back-emf', lsl: 48, nominal: 50, usl: 52, demoValue: 50.3 },
  { code: 'bemf.thd', unit: '%', testStep: 'back-emf', lsl: null, usl: 3, demoValue: 1.1 },
  { code: 'resolver.offset', unit: 'deg', testStep: 'resolver', lsl: -180, usl: 180, demoValue: 12.5 },
];

let sequence = 0;
const next = () => ++sequence;

export async function createProduct(db: Knex, overrides: { code?: string; serialPrefix?: string; serialPattern?: string; characteristics?: CharacteristicSpec[] } = {}): Promise<ProductFixture> {
  const code = overrides.code ?? `TP-${next()}`;
  const serialPrefix = overrides.serialPrefix ?? 'FT';
  const [id] = await db('products').insert({
    code, name: `Traction motor ${code}`, motor_kind: 'pmsm', pole_pairs: 4, resolver_pole_pairs: 4,
    rated_voltage_v: 400, rated_power_kw: 85, rated_speed_rpm: 6000, winding_material: 'copper', winding_type: 'random',
    insulation_class: 'H', serial_pattern: overrides.serialPattern ?? `${serialPrefix}\\d{6}`, created_at: new Date(),
  });
  const characteristics = [];
  for (const [i, spec] of (overrides.characteristics ?? defaultCharacteristics).entries()) {
    const [cid] = await db('characteristics').insert({
      product_id: id, code: spec.code, name: spec.name ?? spec.code, unit: spec.unit, test_step: spec.testStep,
      derived: spec.derived ?? false, sort_order: i + 1, spc_enabled: true,
    });
    characteristics.push({ ...spec, id: Number(cid) });
  }
  forgetReferenceData();
  return { id: Number(id), code, serialPrefix, characteristics };
}

/**
 * A limit revision; by default approved, in force since a year ago, with a limit row per
 * characteristic from its spec. Given `limits`, exactly those rows are written (others have none).
 */
export async function createLimitSet(db: Knex, product: ProductFixture, overrides: {
  revision?: number; status?: 'draft' | 'approved' | 'retired'; effectiveFrom?: Date;
  limits?: Record<string, { lsl: number | null; nominal?: number | null; usl: number | null }>;
} = {}): Promise<LimitSetFixture> {
  const revision = overrides.revision ?? 1;
  const status = overrides.status ?? 'approved';
  const now = new Date();
  const [id] = await db('limit_sets').insert({
    product_id: product.id, revision, status, effective_from: overrides.effectiveFrom ?? new Date(now.getTime() - 365 * 86_400_000),
    authored_by: 'test-quality', authored_by_name: 'Test Quality', authored_at: now,
    approved_by: status === 'draft' ? null : 'test-quality2', approved_by_name: status === 'draft' ? null : 'Test Quality Two',
    approved_at: status === 'draft' ? null : now,
  });
  const rows = product.characteristics.flatMap((c) => {
    const limit = overrides.limits ? overrides.limits[c.code] : c;
    return limit ? [{ limit_set_id: id, characteristic_id: c.id, lsl: limit.lsl, nominal: limit.nominal ?? null, usl: limit.usl }] : [];
  });
  if (rows.length > 0) await db('limits').insert(rows);
  forgetReferenceData();
  return { id: Number(id), revision };
}

/** A station, bound to an OAuth2 client id unless clientId is null; calibrated until next year. */
export async function createStation(db: Knex, overrides: { code?: string; line?: string; calibrationDue?: string; clientId?: string | null } = {}): Promise<StationFixture> {
  const code = overrides.code ?? `EOL-${next()}`;
  const line = overrides.line ?? 'L1';
  const due = overrides.calibrationDue ?? `${new Date().getUTCFullYear() + 1}-06-30`;
  const [id] = await db('stations').insert({ code, line, kind: 'eol-pmsm', name: `End-of-line stand ${code}`, calibration_due: due });
  const clientId = overrides.clientId === undefined ? 'demo-station' : overrides.clientId;
  if (clientId) await db('station_clients').insert({ client_id: clientId, station_id: id });
  forgetReferenceData();
  return { id: Number(id), code, line, clientId };
}

export async function createLot(db: Knex, product: ProductFixture, overrides: { code?: string; components?: Array<{ kind: 'stator' | 'magnet' | 'rotor' | 'resolver'; supplierLotCode: string; supplier?: string }> } = {}): Promise<LotFixture> {
  const code = overrides.code ?? `LOT-${next()}`;
  const [id] = await db('lots').insert({ code, product_id: product.id, created_at: new Date() });
  const components = overrides.components ?? [
    { kind: 'stator', supplierLotCode: `ST-${code}`, supplier: 'Invented Laminations' },
    { kind: 'magnet', supplierLotCode: `MG-${code}`, supplier: 'Invented Magnetics' },
  ];
  if (components.length > 0) {
    await db('lot_components').insert(components.map((c) => ({ lot_id: id, component_kind: c.kind, supplier_lot_code: c.supplierLotCode, supplier: c.supplier ?? null })));
  }
  return { id: Number(id), code };
}

/** Product with the default plan, approved revision 1, a station bound to demo-station, one lot. */
export async function createPlant(db: Knex, overrides: { productCode?: string; stationCode?: string; clientId?: string | null; calibrationDue?: string; lotCode?: string } = {}): Promise<PlantFixture> {
  const product = await createProduct(db, { code: overrides.productCode });
  const limitSet = await createLimitSet(db, product);
  const station = await createStation(db, { code: overrides.stationCode, clientId: overrides.clientId, calibrationDue: overrides.calibrationDue });
  const lot = await createLot(db, product, { code: overrides.lotCode });
  return { product, limitSet, station, lot };
}

export function nextSerial(product: ProductFixture): string {
  return `${product.serialPrefix}${String(next()).padStart(6, '0')}`;
}

/** A valid run document for the plant: every characteristic at its passing demo value, started 10 minutes ago. */
export function runDocument(plant: PlantFixture, overrides: Partial<TestRunDocument> = {}): TestRunDocument {
  const finished = new Date(Date.now() - 5 * 60_000);
  return {
    runId: randomUUID(), serial: nextSerial(plant.product), product: plant.product.code, station: plant.station.code, lot: plant.lot.code,
    startedAt: new Date(finished.getTime() - 5 * 60_000).toISOString(), finishedAt: finished.toISOString(),
    operatorBadge: 'B-1042', programVersion: 'eol-pmsm 3.2.0',
    results: plant.product.characteristics.filter((c) => !c.derived).map((c) => ({ characteristic: c.code, value: c.demoValue, unit: c.unit })),
    ...overrides,
  };
}
