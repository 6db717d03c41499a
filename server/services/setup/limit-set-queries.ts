import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { findProductRow } from './product-rows.js';
import { findLimitSetInForce, findLimitSetRow, limitsOf, toLimitSet, type LimitSetRow } from './limit-set-rows.js';

/** The caller-specific flags the screen needs, so the client never compares identities itself. */
function viewOf(row: LimitSetRow, productCode: string, inForceId: number | undefined, user: SessionUser) {
  return async (db: Knex) => ({
    ...toLimitSet(row, productCode, await limitsOf(db, row.id)),
    inForce: row.id === inForceId,
    authoredByYou: row.authored_by === user.subject,
  });
}

/** Every revision of a product, newest first, each marked whether it is the one in force now. */
export async function listLimitSets(db: Knex, user: SessionUser, productCode: string, now = new Date()) {
  const product = await findProductRow(db, productCode);
  const rows = await db<LimitSetRow>('limit_sets').where({ product_id: product.id }).orderBy('revision', 'desc');
  const inForce = await findLimitSetInForce(db, product.id, now);
  return Promise.all(rows.map((row) => viewOf(row, productCode, inForce?.id, user)(db)));
}

export async function getLimitSet(db: Knex, user: SessionUser, id: number, now = new Date()) {
  const row = await findLimitSetRow(db, id);
  const inForce = await findLimitSetInForce(db, row.product_id, now);
  return viewOf(row, row.product_code, inForce?.id, user)(db);
}
