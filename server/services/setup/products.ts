import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict } from '../../errors.js';
import type { ProductCreateInput, ProductUpdateInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, reasonOf } from './actor.js';
import { findProductRow, productColumns, toProduct, type ProductRow } from './product-rows.js';
import { changeReferenceData } from './change-reference-data.js';

export async function listProducts(db: Knex) {
  const rows = await db<ProductRow>('products').orderBy('code');
  return rows.map(toProduct);
}

export async function getProduct(db: Knex, code: string) {
  return toProduct(await findProductRow(db, code));
}

export async function createProduct(db: Knex, user: SessionUser, input: ProductCreateInput, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    const taken = await trx('products').where({ code: input.code }).first();
    if (taken) throw conflict(`A product with the code ${input.code} exists already.`, [{ field: 'code', message: 'Already in use' }]);
    await trx('products').insert({ code: input.code, ...productColumns(input), created_at: now });
    const product = toProduct(await findProductRow(trx, input.code));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'product.created', entityType: 'product', entityId: product.code,
      after: product, reason: reasonOf(input.reason), at: now,
    });
    return product;
  });
}

export async function updateProduct(db: Knex, user: SessionUser, code: string, input: ProductUpdateInput, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    const before = toProduct(await findProductRow(trx, code, { lock: true }));
    await trx('products').where({ code }).update(productColumns(input));
    const after = toProduct(await findProductRow(trx, code));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'product.updated', entityType: 'product', entityId: code,
      before, after, reason: reasonOf(input.reason), at: now,
    });
    return after;
  });
}
