import type { Knex } from 'knex';
import { conflict, notFound } from '../../errors.js';
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
  /**
   * When the target already has an active hold of this kind (and signal): 'refuse' answers 409,
   * 'keep' returns that hold unchanged and writes nothing (ingest's calibration hold on a retest).
   */
  ifAlreadyHeld?: 'refuse' | 'keep';
};

/**
 * Holds a motor or a whole lot: the hold, the audit event and the new status of every affected
 * motor commit together. Called with a transaction (ingest's calibration hold), it runs inside it.
 * A target carries at most one active hold per kind and signal; the unique key holds_one_active
 * enforces it, so of two concurrent requests one is refused whichever process serves it.
 */
export async function placeHold(db: Knex, input: PlaceHoldInput): Promise<HoldView> {
  return db.transaction(async (trx) => {
    const at = input.at ?? new Date();
    const scope = await lockTarget(trx, input.target);
    const signalId = input.signalId ?? null;
    let id: number;
    try {
      [id] = await trx('holds').insert({
        motor_id: 'motorId' in scope ? scope.motorId : null,
        lot_id: 'lotId' in scope ? scope.lotId : null,
        kind: input.kind, reason: input.reason, signal_id: signalId,
        placed_by: input.actor.name, placed_at: at,
      });
    } catch (error) {
      if ((error as { code?: string }).code !== 'ER_DUP_ENTRY') throw error;
      const held = await activeHold(trx, scope, input.kind, signalId);
      if (input.ifAlreadyHeld === 'keep') return held;
      throw alreadyHeld(input.target, held);
    }
    // Motor rows before the audit chain head, the same lock order as ingest, so the two never deadlock.
    await refreshMotorStatuses(trx, scope);
    const entity = input.target.type === 'motor' ? { entityType: 'motor', entityId: input.target.serial } : { entityType: 'lot', entityId: input.target.code };
    await recordAudit(trx, {
      actor: input.actor, action: 'hold.placed', ...entity,
      after: { holdId: Number(id), kind: input.kind, signalId }, reason: input.reason, at,
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

/** The active hold that took the key; a locking read, so it sees a hold committed a moment ago. */
async function activeHold(trx: Knex.Transaction, scope: MotorScope, kind: HoldKind, signalId: number | null): Promise<HoldView> {
  const row = await holdsQuery(trx)
    .where('motorId' in scope ? { 'holds.motor_id': scope.motorId } : { 'holds.lot_id': scope.lotId })
    .where({ 'holds.kind': kind, 'holds.signal_id': signalId }).whereNull('holds.released_at')
    .forShare().first();
  return toHoldView(row);
}

function alreadyHeld(target: HoldTarget, held: HoldView) {
  const [field, name] = target.type === 'motor' ? ['serial', `Motor ${target.serial}`] : ['code', `Lot ${target.code}`];
  const since = `hold ${held.id}, placed by ${held.placedBy} on ${held.placedAt}`;
  return conflict(`${name} already has an active ${held.kind} hold (${since}: "${held.reason}"). Release it before placing another.`, [
    { field, message: `already on an active ${held.kind} hold (hold ${held.id})` },
  ]);
}
