import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { loadProduct } from './reference-data.js';
import { limitsInForce } from './limits-in-force.js';

export type ProductSummary = { code: string; name: string; motorKind: string; serialPattern: string };
export type TestPlan = {
  product: ProductSummary;
  limitRevision: number | null;
  effectiveFrom: string | null;
  characteristics: Array<{
    code: string; name: string; unit: string; testStep: string; derived: boolean;
    lsl: number | null; nominal: number | null; usl: number | null;
  }>;
};

export async function listProducts(db: Knex): Promise<ProductSummary[]> {
  const rows = await db('products').orderBy('code').select('code', 'name', 'motor_kind', 'serial_pattern');
  return rows.map((r) => ({ code: r.code, name: r.name, motorKind: r.motor_kind, serialPattern: r.serial_pattern }));
}

/**
 * What a stand needs to run a product: its characteristics in test order with units, and the
 * limits of the revision in force at `at`. With no approved revision in force the limits are
 * null and limitRevision is null, and a run posted now would be refused on startedAt.
 */
export async function getTestPlan(db: Knex, productCode: string, at: Date): Promise<TestPlan> {
  const product = await loadProduct(db, productCode);
  if (!product) throw notFound(`No product ${productCode}.`);
  const limitSet = await limitsInForce(db, product.id, at, { fresh: true });
  const characteristics = [...product.characteristics.values()].sort((a, b) => a.sortOrder - b.sortOrder || a.id - b.id);
  return {
    product: { code: product.code, name: product.name, motorKind: product.motorKind, serialPattern: product.serialPatternText },
    limitRevision: limitSet?.revision ?? null,
    effectiveFrom: limitSet?.effectiveFrom.toISOString() ?? null,
    characteristics: characteristics.map((c) => {
      const limit = limitSet?.limits.get(c.id);
      return {
        code: c.code, name: c.name, unit: c.unit, testStep: c.testStep, derived: c.derived,
        lsl: limit?.lsl ?? null, nominal: limit?.nominal ?? null, usl: limit?.usl ?? null,
      };
    }),
  };
}
