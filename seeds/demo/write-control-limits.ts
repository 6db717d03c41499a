import type { Knex } from 'knex';
import { computeTrialLimits } from '../../server/services/spc/compute-trial-limits.js';
import { freezeControlLimits } from '../../server/services/spc/freeze-control-limits.js';
import { subscribeToProduct } from '../../server/services/signals/subscriptions.js';
import { demoActors } from './actors.js';
import type { DemoClock } from './clock.js';

/**
 * Six days ago quality froze an EWMA chart (λ 0.2, L 3: the defaults, made for small sustained
 * shifts) for PM-150's Ke on the runs of the weeks before. Every run since is judged in Phase II
 * during ingest, so the drifting lot opens its signals the same way a live lot would. Both quality
 * engineers subscribed to PM-150 when the limits were frozen, so those signals are mailed to them.
 */
export const controlLimitsFrozenDaysAgo = 6;
const baselineFromDaysAgo = 30;

export async function freezeKeControlLimits(db: Knex, clock: DemoClock): Promise<void> {
  const characteristic = await db('characteristics').join('products', 'products.id', 'characteristics.product_id')
    .where({ 'products.code': 'PM-150', 'characteristics.code': 'ke' }).first('characteristics.id as id');
  const at = clock.at(controlLimitsFrozenDaysAgo);
  const trial = await computeTrialLimits(db, demoActors.quality, Number(characteristic.id), {
    chartKind: 'ewma', from: clock.at(baselineFromDaysAgo), to: at,
  }, at);
  await freezeControlLimits(db, demoActors.quality, trial.id, at);
  for (const engineer of [demoActors.quality, demoActors.secondQuality]) {
    await subscribeToProduct(db, { subject: engineer.subject, email: engineer.email, productCode: 'PM-150' }, at);
  }
}
