import type { Knex } from 'knex';
import { forgetStations } from './station-of-client.js';

/**
 * Per-process cache of what every ingest reads but rarely changes: products with their
 * characteristics, lots, and the limits of approved limit sets. Approved limits never change
 * (a change is a new revision), so they are kept until forgotten; products and lots expire after
 * a short time so that another app process's changes are seen soon. Services that change
 * products, characteristics, lots or stations call forgetReferenceData() in their own process.
 * Which limit set is in force is always read fresh; stations are cached for seconds only.
 */
const productTtlMs = 10_000;

export type CharacteristicRef = { id: number; code: string; name: string; unit: string; testStep: string; derived: boolean; sortOrder: number };
export type ProductRef = {
  id: number; code: string; name: string; motorKind: string; serialPattern: RegExp; serialPatternText: string;
  /** What derived characteristics need: angle ratios and the conductor's temperature coefficient. */
  polePairs: number; resolverPolePairs: number | null; windingMaterial: 'copper' | 'aluminium';
  characteristics: Map<string, CharacteristicRef>;
};
export type LotRef = { id: number; code: string; productId: number };
export type LimitRow = { lsl: number | null; nominal: number | null; usl: number | null };

const products = new Map<string, { value: ProductRef; expiresAtMs: number }>();
const lots = new Map<string, { value: LotRef; expiresAtMs: number }>();
const limitsBySet = new Map<number, Map<number, LimitRow>>();
/** Each product's approved revisions, newest first, as last read (see limits-in-force.ts). */
const approvedRevisionsByProduct = new Map<number, ApprovedRevision[]>();

/** An approved revision of a product: in force from effectiveFrom until a later approval. */
export type ApprovedRevision = { id: number; revision: number; effectiveFrom: Date };

export function forgetReferenceData(): void {
  forgetStations();
  products.clear();
  lots.clear();
  limitsBySet.clear();
  approvedRevisionsByProduct.clear();
}

export function knownApprovedRevisions(productId: number): ApprovedRevision[] | undefined {
  return approvedRevisionsByProduct.get(productId);
}

export function rememberApprovedRevisions(productId: number, newestFirst: ApprovedRevision[]): void {
  approvedRevisionsByProduct.set(productId, newestFirst);
}

export async function loadProduct(db: Knex, code: string): Promise<ProductRef | null> {
  const cached = products.get(code);
  if (cached && cached.expiresAtMs > Date.now()) return cached.value;
  const row = await db('products').where({ code }).first('id', 'code', 'name', 'motor_kind', 'serial_pattern', 'pole_pairs', 'resolver_pole_pairs', 'winding_material');
  if (!row) return null;
  const characteristicRows = await db('characteristics').where({ product_id: row.id })
    .select('id', 'code', 'name', 'unit', 'test_step', 'derived', 'sort_order').orderBy(['sort_order', 'id']);
  const value: ProductRef = {
    id: row.id, code: row.code, name: row.name, motorKind: row.motor_kind,
    polePairs: row.pole_pairs, resolverPolePairs: row.resolver_pole_pairs, windingMaterial: row.winding_material,
    // Anchored so that a pattern like "PM-\d+" cannot match inside a longer serial.
    serialPattern: new RegExp(`^(?:${row.serial_pattern})$`),
    serialPatternText: row.serial_pattern,
    characteristics: new Map(characteristicRows.map((c) => [c.code, {
      id: c.id, code: c.code, name: c.name, unit: c.unit, testStep: c.test_step, derived: Boolean(c.derived), sortOrder: c.sort_order,
    }])),
  };
  products.set(code, { value, expiresAtMs: Date.now() + productTtlMs });
  return value;
}

export async function loadLot(db: Knex, code: string): Promise<LotRef | null> {
  const cached = lots.get(code);
  if (cached && cached.expiresAtMs > Date.now()) return cached.value;
  const row = await db('lots').where({ code }).first('id', 'code', 'product_id');
  if (!row) return null;
  const value = { id: row.id, code: row.code, productId: row.product_id };
  lots.set(code, { value, expiresAtMs: Date.now() + productTtlMs });
  return value;
}

/** The limits of one approved limit set by characteristic id (immutable, so cached). */
export async function loadApprovedLimits(db: Knex, limitSetId: number): Promise<Map<number, LimitRow>> {
  const cached = limitsBySet.get(limitSetId);
  if (cached) return cached;
  const rows = await db('limits').where({ limit_set_id: limitSetId }).select('characteristic_id', 'lsl', 'nominal', 'usl');
  const value = new Map(rows.map((r) => [r.characteristic_id as number, { lsl: r.lsl, nominal: r.nominal, usl: r.usl }]));
  limitsBySet.set(limitSetId, value);
  return value;
}
