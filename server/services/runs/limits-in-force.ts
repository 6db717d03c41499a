import type { Knex } from 'knex';
import { loadApprovedLimits, type LimitRow } from './reference-data.js';

export type LimitSetInForce = { id: number; revision: number; effectiveFrom: Date; limits: Map<number, LimitRow> };

/**
 * The approved limit revision in force at a moment: the approved set of the product with the
 * latest effective_from not after that moment. Read fresh each time, because approving a new
 * revision must take effect at once; the limits themselves are cached by set id.
 */
export async function limitsInForce(db: Knex, product: { id: number } | { code: string }, at: Date): Promise<LimitSetInForce | null> {
  // By code, ingest can ask this in parallel with loading the product itself.
  const productId = 'id' in product ? product.id : db('products').select('id').where({ code: product.code });
  const set = await db('limit_sets')
    .where({ product_id: productId, status: 'approved' })
    .andWhere('effective_from', '<=', at)
    .orderBy([{ column: 'effective_from', order: 'desc' }, { column: 'revision', order: 'desc' }])
    .first('id', 'revision', 'effective_from');
  if (!set) return null;
  return { id: set.id, revision: set.revision, effectiveFrom: set.effective_from, limits: await loadApprovedLimits(db, set.id) };
}
