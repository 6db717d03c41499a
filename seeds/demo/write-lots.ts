import type { Knex } from 'knex';
import type { DemoClock } from './clock.js';
import { demoLots } from './lots.js';

/**
 * Lots with their component lots. Lots are production planning data (there is no lot operation
 * in Setup to go through), created the day before their first motor reaches the stands.
 */
export async function writeLots(db: Knex, clock: DemoClock): Promise<void> {
  const products = new Map((await db('products').select('id', 'code')).map((p) => [p.code as string, p.id as number]));
  await db.transaction(async (trx) => {
    for (const lot of demoLots) {
      const [lotId] = await trx('lots').insert({ code: lot.code, product_id: products.get(lot.productCode), created_at: clock.at(lot.startDaysAgo + 1) });
      await trx('lot_components').insert(lot.components.map((c) => ({
        lot_id: lotId, component_kind: c.kind, supplier_lot_code: c.supplierLotCode, supplier: c.supplier,
      })));
    }
  });
}
