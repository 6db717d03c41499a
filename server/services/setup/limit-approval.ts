import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict, forbidden, invalid } from '../../errors.js';
import type { ApproveInput, RetireInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, reasonOf } from './actor.js';
import { findLimitSetRow, loadLimitSet } from './limit-set-rows.js';

/** Clock skew allowed between the approver's browser and the server. */
const PAST_TOLERANCE_MS = 5 * 60_000;

/**
 * Approves a draft from a given time on. Two people: the approver is a quality user other than
 * the author. Nothing earlier is retired: runs started before effectiveFrom keep the revision
 * that was in force for them, and the in-force look-up picks the newest approval per start time.
 */
export async function approveLimitSet(db: Knex, user: SessionUser, id: number, input: ApproveInput, now = new Date()) {
  const effectiveFrom = new Date(input.effectiveFrom);
  if (effectiveFrom.getTime() < now.getTime() - PAST_TOLERANCE_MS) {
    throw invalid([{ field: 'effectiveFrom', message: 'Must not lie in the past: runs already judged keep the limits they were judged by' }]);
  }
  return db.transaction(async (trx) => {
    const row = await findLimitSetRow(trx, id, { lock: true });
    if (row.status !== 'draft') throw conflict(`Revision ${row.revision} of ${row.product_code} is ${row.status}; only a draft can be approved.`);
    if (user.role !== 'quality') throw forbidden('Limit revisions are approved by a quality user.');
    if (row.authored_by === user.subject) {
      throw forbidden(`You authored revision ${row.revision}; a second quality user must approve it.`);
    }
    const before = await loadLimitSet(trx, id);
    if (before.limitSet.limits.length === 0) {
      throw invalid([{ field: 'limits', message: 'A revision without limits cannot be approved' }]);
    }
    await trx('limit_sets').where({ id }).update({
      status: 'approved', effective_from: effectiveFrom,
      approved_by: user.subject, approved_by_name: user.name, approved_at: now,
    });
    const after = await loadLimitSet(trx, id);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'limit_set.approved', entityType: 'limit_set', entityId: id,
      before: before.limitSet, after: after.limitSet, reason: reasonOf(input.reason), at: now,
    });
    return after.limitSet;
  });
}

/** Takes an approved revision out of use for new runs; runs already judged by it keep it. */
export async function retireLimitSet(db: Knex, user: SessionUser, id: number, input: RetireInput, now = new Date()) {
  return db.transaction(async (trx) => {
    const row = await findLimitSetRow(trx, id, { lock: true });
    if (row.status !== 'approved') throw conflict(`Revision ${row.revision} of ${row.product_code} is ${row.status}; only an approved revision can be retired.`);
    const before = await loadLimitSet(trx, id);
    await trx('limit_sets').where({ id }).update({ status: 'retired', retired_at: input.retiredFrom ? new Date(input.retiredFrom) : now });
    const after = await loadLimitSet(trx, id);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'limit_set.retired', entityType: 'limit_set', entityId: id,
      before: before.limitSet, after: after.limitSet, reason: input.reason, at: now,
    });
    return after.limitSet;
  });
}
