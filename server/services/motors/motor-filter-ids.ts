import type { Knex } from 'knex';

export type FilterIds = { productId?: number; lotId?: number; stationId?: number };

/**
 * The ids behind the list filter's codes, in one round trip. Null when a code names nothing or the
 * lot belongs to another product: no motor can match. A lot implies its product, so the product
 * filter is then dropped, leaving the lot's own index to serve the query.
 */
export async function resolveFilterCodes(db: Knex, filter: { product?: string; lot?: string; station?: string }): Promise<FilterIds | null> {
  const lookups: Record<string, Knex.QueryBuilder> = {};
  if (filter.product) lookups.productId = db('products').select('id').where({ code: filter.product });
  if (filter.lot) {
    lookups.lotId = db('lots').select('id').where({ code: filter.lot });
    lookups.lotProductId = db('lots').select('product_id').where({ code: filter.lot });
  }
  if (filter.station) lookups.stationId = db('stations').select('id').where({ code: filter.station });
  if (Object.keys(lookups).length === 0) return {};
  const found: Record<string, number | null> = await db.select(lookups).first();
  if (Object.values(found).some((id) => id === null)) return null;
  if (filter.product && filter.lot && found.lotProductId !== found.productId) return null;
  return {
    ...(filter.lot ? { lotId: found.lotId! } : filter.product ? { productId: found.productId! } : {}),
    ...(filter.station ? { stationId: found.stationId! } : {}),
  };
}
