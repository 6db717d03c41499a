import type { Knex } from 'knex';
import { conflict, notFound } from '../../errors.js';
import { recordAudit, type Actor } from '../audit/record-audit.js';
import { refreshMotorStatuses } from '../motors/refresh-motor-status.js';
import { holdsQuery, toHoldView, type HoldView } from './hold-view.js';

export type ReleaseHoldInput = { holdId: number; reason: string; actor: Actor; at?: Date };

/**
 * Releases an active hold with a reason. The hold row keeps who placed and who released it; the
 * affected motors' statuses and the audit event commit with the release. Releasing twice is a 409.
 */
export async function releaseHold(db: Knex, input: ReleaseHoldInput): Promise<HoldView> {
  return db.transaction(async (trx) => {
    const at = input.at ?? new Date();
    const locked = await trx('holds').where({ id: input.holdId }).forUpdate().first('id');
    if (!locked) throw notFound(`No hold ${input.holdId}.`);
    const hold = await holdsQuery(trx).where('holds.id', input.holdId).first();
    if (hold.released_at) throw conflict(`Hold ${input.holdId} was already released on ${hold.released_at.toISOString()} by ${hold.released_by}.`);
    await trx('holds').where({ id: input.holdId }).update({ released_by: input.actor.name, released_at: at, release_reason: input.reason });
    await refreshMotorStatuses(trx, hold.motor_id !== null ? { motorId: hold.motor_id } : { lotId: hold.lot_id });
    const before = toHoldView(hold);
    await recordAudit(trx, {
      actor: input.actor, action: 'hold.released',
      ...(before.target.type === 'motor' ? { entityType: 'motor', entityId: before.target.serial } : { entityType: 'lot', entityId: before.target.code }),
      before: { holdId: before.id, kind: before.kind, reason: before.reason, placedBy: before.placedBy }, after: { holdId: before.id, released: true },
      reason: input.reason, at,
    });
    return toHoldView(await holdsQuery(trx).where('holds.id', input.holdId).first());
  });
}
