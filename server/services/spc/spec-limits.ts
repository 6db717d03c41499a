import type { Knex } from 'knex';

/** LSL/USL of the approved limit revision in force now, for the chart's spec lines and capability. */
export async function specLimitsOf(db: Knex, characteristicId: number, now = new Date()): Promise<{ lsl: number | null; usl: number | null; revision: number } | null> {
  const row = await db('limits')
    .join('limit_sets', 'limit_sets.id', 'limits.limit_set_id')
    .join('characteristics', 'characteristics.id', 'limits.characteristic_id')
    .where('limits.characteristic_id', characteristicId)
    .andWhere('limit_sets.status', 'approved')
    .andWhere('limit_sets.effective_from', '<=', now)
    .orderBy([{ column: 'limit_sets.effective_from', order: 'desc' }, { column: 'limit_sets.revision', order: 'desc' }])
    .first('limits.lsl', 'limits.usl', 'limit_sets.revision');
  return row ? { lsl: row.lsl, usl: row.usl, revision: row.revision } : null;
}

export async function characteristicFacts(db: Knex, characteristicId: number) {
  return db('characteristics').join('products', 'products.id', 'characteristics.product_id')
    .where('characteristics.id', characteristicId)
    .first('characteristics.id', 'characteristics.code', 'characteristics.name', 'characteristics.unit',
      'characteristics.spc_enabled', 'characteristics.product_id', 'products.code as product_code');
}
