import type { Knex } from 'knex';

/** The picker: products and their characteristics, with whether SPC is on and limits are frozen. */
export async function spcCharacteristics(db: Knex, productCode?: string) {
  const query = db('characteristics').join('products', 'products.id', 'characteristics.product_id')
    .orderBy([{ column: 'products.code' }, { column: 'characteristics.sort_order' }, { column: 'characteristics.code' }])
    .select('characteristics.id', 'characteristics.code', 'characteristics.name', 'characteristics.unit', 'characteristics.spc_enabled', 'products.code as product',
      db.raw("(SELECT status FROM control_limits cl WHERE cl.characteristic_id = characteristics.id AND cl.status IN ('trial','frozen') ORDER BY cl.status = 'frozen' DESC, cl.id DESC LIMIT 1) AS limits_status"));
  if (productCode) query.where('products.code', productCode);
  const rows: Array<{ id: number; code: string; name: string; unit: string; spc_enabled: number; product: string; limits_status: string | null }> = await query;
  return {
    characteristics: rows.map((r) => ({ id: r.id, code: r.code, name: r.name, unit: r.unit, product: r.product, spcEnabled: Boolean(r.spc_enabled), limitsStatus: r.limits_status })),
  };
}
