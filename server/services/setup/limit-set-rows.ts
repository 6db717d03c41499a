import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { isoTime } from './actor.js';

export type LimitSetRow = {
  id: number; product_id: number; revision: number; status: 'draft' | 'approved' | 'retired';
  effective_from: Date | null; note: string | null; authored_by: string; authored_by_name: string;
  authored_at: Date; approved_by: string | null; approved_by_name: string | null;
  approved_at: Date | null; retired_at: Date | null;
};

export type LimitValues = { characteristicCode: string; lsl: number | null; nominal: number | null; usl: number | null };

/** A revision with its limits, as the API and the audit trail show it (subjects stay server-side). */
export type LimitSet = ReturnType<typeof toLimitSet>;

export function toLimitSet(row: LimitSetRow, productCode: string, limits: LimitValues[]) {
  return {
    id: row.id,
    productCode,
    revision: row.revision,
    status: row.status,
    effectiveFrom: isoTime(row.effective_from),
    note: row.note,
    authoredByName: row.authored_by_name,
    authoredAt: row.authored_at.toISOString(),
    approvedByName: row.approved_by_name,
    approvedAt: isoTime(row.approved_at),
    retiredAt: isoTime(row.retired_at),
    limits,
  };
}

export async function limitsOf(db: Knex, limitSetId: number): Promise<LimitValues[]> {
  const rows = await db('limits')
    .join('characteristics', 'characteristics.id', 'limits.characteristic_id')
    .where('limits.limit_set_id', limitSetId)
    .orderBy([{ column: 'characteristics.sort_order' }, { column: 'characteristics.code' }])
    .select<Array<{ code: string; lsl: number | null; nominal: number | null; usl: number | null }>>(
      'characteristics.code', 'limits.lsl', 'limits.nominal', 'limits.usl',
    );
  return rows.map((row) => ({ characteristicCode: row.code, lsl: row.lsl, nominal: row.nominal, usl: row.usl }));
}

/** One revision row with its product code; 404 when unknown. */
export async function findLimitSetRow(db: Knex, id: number, options: { lock?: boolean } = {}) {
  const query = db('limit_sets')
    .join('products', 'products.id', 'limit_sets.product_id')
    .where('limit_sets.id', id)
    .first<(LimitSetRow & { product_code: string }) | undefined>('limit_sets.*', 'products.code as product_code');
  const row = await (options.lock ? query.forUpdate() : query);
  if (!row) throw notFound(`No limit revision with the id ${id}.`);
  return row;
}

export async function loadLimitSet(db: Knex, id: number): Promise<{ row: LimitSetRow; limitSet: LimitSet }> {
  const row = await findLimitSetRow(db, id);
  return { row, limitSet: toLimitSet(row, row.product_code, await limitsOf(db, id)) };
}

/**
 * The approved revision that applies to a run starting at `at`: the latest effective_from not
 * after it. Retired revisions are skipped; a newer approval never rewrites what applied earlier.
 */
export async function findLimitSetInForce(
  db: Knex, productId: number, at: Date, options: { excludeId?: number } = {},
): Promise<LimitSetRow | undefined> {
  const query = db<LimitSetRow>('limit_sets')
    .where({ product_id: productId, status: 'approved' })
    .andWhere('effective_from', '<=', at)
    .orderBy([{ column: 'effective_from', order: 'desc' }, { column: 'revision', order: 'desc' }])
    .first();
  if (options.excludeId !== undefined) query.andWhereNot('id', options.excludeId);
  return query;
}
