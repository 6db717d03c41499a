import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { recordAudit } from '../audit/record-audit.js';
import { releaseHold } from '../holds/release-hold.js';
import { actorOf } from '../setup/actor.js';
import { findSignal, lockSignal, toSignalSummary, type SignalSummary } from './signal-rows.js';

export type Disposition = { cause: string; actionTaken: string; outcome: 'released' | 'scrapped' | 'reworked' };

/**
 * Closes the signal with its disposition. Released: the signal's holds are released with it, in
 * the same transaction. Scrapped or reworked: the holds stay until the motors are dealt with in
 * their own records, so a motor never ships by closing a form.
 */
export async function closeSignal(db: Knex, user: SessionUser, id: number, disposition: Disposition, now = new Date()): Promise<SignalSummary & { releasedHolds: number }> {
  return db.transaction(async (trx) => {
    const signal = await lockSignal(trx, id, ['open', 'acknowledged', 'contained'], 'closed');
    let releasedHolds = 0;
    if (disposition.outcome === 'released') {
      const holds: Array<{ id: number }> = await trx('holds').where({ signal_id: id }).whereNull('released_at').orderBy('id').select('id');
      for (const hold of holds) {
        await releaseHold(trx, { holdId: hold.id, reason: `Signal ${id} closed, motors released: ${disposition.cause}`, actor: actorOf(user), at: now });
      }
      releasedHolds = holds.length;
    }
    await trx('signals').where({ id }).update({
      status: 'closed', cause: disposition.cause, action_taken: disposition.actionTaken, outcome: disposition.outcome, closed_by: user.name, closed_at: now,
    });
    await recordAudit(trx, {
      actor: actorOf(user), action: 'signal.closed', entityType: 'signal', entityId: id,
      before: { status: signal.status }, after: { status: 'closed', ...disposition, releasedHolds }, reason: disposition.cause, at: now,
    });
    return { ...toSignalSummary(await findSignal(trx, id)), releasedHolds };
  });
}
