import type { Knex } from 'knex';
import { recordAudit } from '../../server/services/audit/record-audit.js';
import { createProduct } from '../../server/services/setup/products.js';
import { toCharacteristic, type CharacteristicRow } from '../../server/services/setup/characteristics.js';
import { approveLimitSet, createLimitDraft, replaceDraftLimits } from '../../server/services/setup/index.js';
import { demoActors } from './actors.js';
import type { DemoClock } from './clock.js';
import { demoLimitRevisions } from './limits.js';
import { demoProducts, type DemoProduct } from './products.js';

/** Products, their characteristics and limit revisions, through Setup's own audited operations. */
export async function writeProducts(db: Knex, clock: DemoClock): Promise<void> {
  for (const product of demoProducts) {
    const createdAt = clock.at(70);
    const { characteristics, ...input } = product;
    await createProduct(db, demoActors.quality, input, createdAt);
    await writeCharacteristics(db, product, createdAt);
  }
  for (const [index, revision] of demoLimitRevisions.entries()) {
    const authoredAt = clock.at(revision.authoredDaysAgo);
    // A later revision starts as a copy of the one in force, as the Setup screen offers.
    const first = demoLimitRevisions.findIndex((r) => r.productCode === revision.productCode) === index;
    const draft = await createLimitDraft(db, demoActors.quality, revision.productCode,
      { basis: first ? 'empty' : 'in-force', note: revision.note }, authoredAt);
    await replaceDraftLimits(db, demoActors.quality, draft.id, { limits: revision.limits, reason: revision.note }, authoredAt);
    if (revision.approval) {
      await approveLimitSet(db, demoActors.secondQuality, draft.id, {
        effectiveFrom: clock.at(revision.approval.effectiveDaysAgo).toISOString(), reason: revision.approval.reason,
      }, clock.at(revision.approval.daysAgo));
    }
  }
}

/**
 * Setup's createCharacteristic does not take the `derived` flag (it is Fluxtrail's own knowledge of
 * what it will compute), so the demo inserts the rows itself and audits each as Setup would.
 */
async function writeCharacteristics(db: Knex, product: DemoProduct, at: Date): Promise<void> {
  await db.transaction(async (trx) => {
    const { id: productId } = await trx('products').where({ code: product.code }).first('id');
    for (const [index, c] of product.characteristics.entries()) {
      const spc = c.spc;
      await trx('characteristics').insert({
        product_id: productId, code: c.code, name: c.name, unit: c.unit, test_step: c.testStep,
        spc_enabled: spc !== undefined, subgroup_mode: spc?.mode ?? 'individual',
        subgroup_size: spc?.mode === 'consecutive' ? spc.size : null, derived: c.derived ?? false, sort_order: (index + 1) * 10,
      });
      const row = await trx<CharacteristicRow>('characteristics').where({ product_id: productId, code: c.code }).first();
      await recordAudit(trx, {
        actor: { name: demoActors.quality.name, role: demoActors.quality.role }, action: 'characteristic.created',
        entityType: 'characteristic', entityId: `${product.code}/${c.code}`, after: toCharacteristic(row as CharacteristicRow),
        reason: 'Demo plant: test plan of the product', at,
      });
    }
  });
}
