import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { recordAudit } from '../audit/record-audit.js';
import { placeHold } from '../holds/place-hold.js';
import { notifySubscribers } from '../mail/signal-messages.js';
import { actorOf } from '../setup/actor.js';
import { affectedMotors } from './affected-motors.js';
import { findSignal, lockSignal, toSignalSummary, type SignalSummary } from './signal-rows.js';

/**
 * Holds every affected motor (see affectedMotors) in one transaction with the signal's new
 * status, its audit event and the subscribers' e-mails: either all of it happens or none.
 * Motor rows are locked in id order before any hold writes the audit chain, the order ingest
 * uses too (motor, then audit), so containment and a running line queue rather than deadlock.
 */
export async function containSignal(db: Knex, user: SessionUser, id: number, note: string | undefined, now = new Date()): Promise<SignalSummary & { heldSerials: string[] }> {
  return db.transaction(async (trx) => {
    const signal = await lockSignal(trx, id, ['open', 'acknowledged'], 'contained');
    const motors = await affectedMotors(trx, signal);
    await trx('motors').whereIn('id', motors.map((m) => m.id)).orderBy('id').forUpdate().select('id');
    const reason = `Contained for signal ${id} (${signal.characteristic_name}, ${signal.rule}, lot ${signal.lot_code})${note ? `: ${note}` : ''}`;
    const toHold = motors.filter((m) => !m.heldBySignal);
    for (const motor of toHold) {
      await placeHold(trx, { target: { type: 'motor', serial: motor.serial }, kind: 'signal', reason, actor: actorOf(user), signalId: id, at: now });
    }
    await trx('signals').where({ id }).update({ status: 'contained', contained_by: user.name, contained_at: now });
    const heldSerials = toHold.map((m) => m.serial);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'signal.contained', entityType: 'signal', entityId: id,
      before: { status: signal.status }, after: { status: 'contained', heldMotors: heldSerials.length, serials: heldSerials }, reason: note ?? null, at: now,
    });
    await notifySubscribers(trx, id, 'contained', now, `${heldSerials.length} motor(s) placed on hold: ${heldSerials.join(', ') || 'none'}.`);
    return { ...toSignalSummary(await findSignal(trx, id)), heldSerials };
  });
}
