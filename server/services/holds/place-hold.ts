import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { recordAudit, type Actor } from '../audit/record-audit.js';
import { refreshMotorStatuses, type MotorScope } from '../motors/refresh-motor-status.js';
import { holdsQuery, toHoldView, type HoldKind, type HoldTarget, type HoldView } from './hold-view.js';

export type PlaceHoldInput = {
  target: HoldTarget;
  kind: HoldKind;
  reason: string;
  actor: Actor;
  signalId?: number | null;
  at?: Date;
};

/**
 * Holds a motor or a whole lot: the hold, the audit event and the new status of every affected
 * motor commit together. Called with a transaction (ingest's calibration hold), it runs inside it.
 */
export async function placeHold(db: Knex, input: PlaceHoldInput): Promise<HoldView> {
  return db.transaction(async (trx) => {
    const at = input.at ?? new Date();
    const scope = await lockTarget(trx, input.target);
    const [id] = await trx('holds').insert({
      motor_id: 'motorId' in scope ? scope.motorId : null,
      lot_id: 'lotId' in scope ? scope.lotId : null,
      kind: input.kind, reason: input.reason, signal_id: input.signalId ?? null,
      placed_by: input.actor.name, placed_at: at,
    });
    // Motor rows before the audit chain head, the same lock order as ingest, so the two never deadlock.
    await refreshMotorStatuses(trx, scope);
    const entity = input.target.type === 'motor' ? { entityType: 'motor', entityId: input.target.serial } : { entityType: 'lot', entityId: input.target.code };
    await recordAudit(trx, {
      actor: input.actor, action: 'hold.placed', ...entity,
      after: { holdId: Number(id), kind: input.kind, signalId: input.signalId ?? null }, reason: input.reason, at,
    });
    return toHoldView(await holdsQuery(trx).where('holds.id', id).first());
  });
}

async function lockTarget(trx: Knex.Transaction, target: HoldTarget): Promise<MotorScope> {
  if (target.type === 'motor') {
    const motor = await trx('motors').where({ serial: target.serial }).forUpdate().first('id');
    if (!motor) throw notFound(`No motor with serial ${target.serial}.`);
    return { motorId: motor.id };
  }
  const lot = await trx('lots').where({ code: target.code }).forUpdate().first('id');
  if (!lot) throw notFound(`No lot ${target.code}.`);
  return { lotId: lot.id };
}
