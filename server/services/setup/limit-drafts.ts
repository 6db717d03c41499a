import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict, forbidden, invalid } from '../../errors.js';
import type { DraftCreateInput, DraftLimitsInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, reasonOf } from './actor.js';
import { characteristicRowsOf } from './characteristics.js';
import { findProductRow } from './product-rows.js';
import { findLimitSetInForce, findLimitSetRow, loadLimitSet } from './limit-set-rows.js';

/**
 * Starts the next revision of a product's limits, empty or as a copy of the one in force. One
 * draft at a time per product, so reviewers never have to choose between competing drafts.
 */
export async function createLimitDraft(db: Knex, user: SessionUser, productCode: string, input: DraftCreateInput, now = new Date()) {
  return db.transaction(async (trx) => {
    const product = await findProductRow(trx, productCode, { lock: true });
    const openDraft = await trx('limit_sets').where({ product_id: product.id, status: 'draft' }).first();
    if (openDraft) throw conflict(`Product ${productCode} already has draft revision ${openDraft.revision}; edit or discard it first.`);
    const latest = await trx('limit_sets').where({ product_id: product.id }).max<{ revision: number | null }>('revision as revision').first();
    const basis = input.basis === 'in-force' ? await findLimitSetInForce(trx, product.id, now) : undefined;
    if (input.basis === 'in-force' && !basis) {
      throw invalid([{ field: 'basis', message: `Product ${productCode} has no revision in force to copy; start empty` }]);
    }
    const [id] = await trx('limit_sets').insert({
      product_id: product.id, revision: (latest?.revision ?? 0) + 1, status: 'draft', note: input.note ?? null,
      authored_by: user.subject, authored_by_name: user.name, authored_at: now,
    });
    if (basis) {
      await trx.raw(
        'INSERT INTO limits (limit_set_id, characteristic_id, lsl, nominal, usl) SELECT ?, characteristic_id, lsl, nominal, usl FROM limits WHERE limit_set_id = ?',
        [id, basis.id],
      );
    }
    const { limitSet } = await loadLimitSet(trx, Number(id));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'limit_set.draft_created', entityType: 'limit_set', entityId: limitSet.id,
      after: { ...limitSet, copiedFromRevision: basis?.revision ?? null }, reason: reasonOf(input.reason), at: now,
    });
    return limitSet;
  });
}

/** Locks a draft for change; only its author writes into it, which keeps the second pair of eyes honest. */
async function lockOwnDraft(trx: Knex.Transaction, user: SessionUser, id: number) {
  const row = await findLimitSetRow(trx, id, { lock: true });
  if (row.status !== 'draft') throw conflict(`Revision ${row.revision} of ${row.product_code} is ${row.status}; only a draft can change.`);
  if (row.authored_by !== user.subject) {
    throw forbidden(`Revision ${row.revision} is ${row.authored_by_name}'s draft; only its author edits it. Review it, or discard it and start your own.`);
  }
  return row;
}

/** Replaces the draft's limits as a whole: the editor table sends every row it shows. */
export async function replaceDraftLimits(db: Knex, user: SessionUser, id: number, input: DraftLimitsInput, now = new Date()) {
  return db.transaction(async (trx) => {
    const row = await lockOwnDraft(trx, user, id);
    const characteristicIds = new Map((await characteristicRowsOf(trx, row.product_id)).map((c) => [c.code, c.id]));
    const unknown = input.limits.flatMap((limit, i) => characteristicIds.has(limit.characteristicCode) ? [] : [{
      field: `limits[${i}].characteristicCode`, message: `Product ${row.product_code} has no characteristic ${limit.characteristicCode}`,
    }]);
    if (unknown.length > 0) throw invalid(unknown);
    const before = await loadLimitSet(trx, id);
    await trx('limits').where({ limit_set_id: id }).delete();
    if (input.limits.length > 0) {
      await trx('limits').insert(input.limits.map((limit) => ({
        limit_set_id: id, characteristic_id: characteristicIds.get(limit.characteristicCode),
        lsl: limit.lsl, nominal: limit.nominal, usl: limit.usl,
      })));
    }
    if (input.note !== undefined) await trx('limit_sets').where({ id }).update({ note: input.note });
    const after = await loadLimitSet(trx, id);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'limit_set.limits_edited', entityType: 'limit_set', entityId: id,
      before: before.limitSet, after: after.limitSet, reason: reasonOf(input.reason), at: now,
    });
    return after.limitSet;
  });
}

/** Throws a draft away. Any limits author may, because a stale draft blocks the next revision. */
export async function discardLimitDraft(db: Knex, user: SessionUser, id: number, reason: string | undefined, now = new Date()) {
  return db.transaction(async (trx) => {
    const row = await findLimitSetRow(trx, id, { lock: true });
    if (row.status !== 'draft') throw conflict(`Revision ${row.revision} of ${row.product_code} is ${row.status}; only a draft can be discarded.`);
    const { limitSet } = await loadLimitSet(trx, id);
    await trx('limits').where({ limit_set_id: id }).delete();
    await trx('limit_sets').where({ id }).delete();
    await recordAudit(trx, {
      actor: actorOf(user), action: 'limit_set.draft_discarded', entityType: 'limit_set', entityId: id,
      before: limitSet, reason: reasonOf(reason), at: now,
    });
    return { id, productCode: row.product_code, revision: row.revision };
  });
}
