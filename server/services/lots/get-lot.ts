import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { holdsQuery, toHoldView, type HoldView } from '../holds/hold-view.js';
import type { MotorStatus } from '../motors/list-motors.js';
import { componentsOfLot, type LotComponentView } from './lot-components.js';
import { countsByLot, type LotCounts } from './list-lots.js';

export type LotRecord = {
  code: string; product: { code: string; name: string }; createdAt: string;
  components: LotComponentView[]; counts: LotCounts; holds: HoldView[];
  motors: Array<{ serial: string; status: MotorStatus; attempts: number; lastTestedAt: string | null }>;
};

/** One lot with its component lots, its holds (active and released) and its motors by serial. */
export async function getLot(db: Knex, code: string): Promise<LotRecord> {
  const lot = await db('lots').join('products', 'products.id', 'lots.product_id').where('lots.code', code)
    .first('lots.id', 'lots.code', 'lots.created_at', 'products.code as product_code', 'products.name as product_name');
  if (!lot) throw notFound(`No lot ${code}.`);
  const [components, counts, holds, motors] = await Promise.all([
    componentsOfLot(db, lot.id),
    countsByLot(db, [lot.id]),
    holdsQuery(db).where('holds.lot_id', lot.id),
    db('motors').where({ lot_id: lot.id }).orderBy('serial').select('serial', 'status', 'attempts', 'last_tested_at'),
  ]);
  return {
    code: lot.code, product: { code: lot.product_code, name: lot.product_name }, createdAt: lot.created_at.toISOString(),
    components, counts: counts.get(lot.id) ?? { motors: 0, passed: 0, failed: 0, onHold: 0, notTested: 0 },
    holds: holds.map(toHoldView),
    motors: motors.map((m) => ({ serial: m.serial, status: m.status, attempts: m.attempts, lastTestedAt: m.last_tested_at?.toISOString() ?? null })),
  };
}
