import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { invalid } from '../../errors.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf } from '../setup/actor.js';
import { lockSignal, toSignalSummary, findSignal, type SignalSummary } from './signal-rows.js';

/** Someone is looking at it: open → acknowledged. */
export async function acknowledgeSignal(db: Knex, user: SessionUser, id: number, now = new Date()): Promise<SignalSummary> {
  return db.transaction(async (trx) => {
    await lockSignal(trx, id, ['open'], 'acknowledged');
    await trx('signals').where({ id }).update({ status: 'acknowledged', acknowledged_by: user.name, acknowledged_at: now });
    await recordAudit(trx, { actor: actorOf(user), action: 'signal.acknowledged', entityType: 'signal', entityId: id, before: { status: 'open' }, after: { status: 'acknowledged' }, at: now });
    return toSignalSummary(await findSignal(trx, id));
  });
}

/** Hands the investigation to a quality engineer known to Fluxtrail (signed in at least once). */
export async function assignSignal(db: Knex, user: SessionUser, id: number, assigneeSubject: string, now = new Date()): Promise<SignalSummary> {
  return db.transaction(async (trx) => {
    const before = await lockSignal(trx, id, ['open', 'acknowledged', 'contained'], 'assigned');
    const assignee = await trx('users').where({ subject: assigneeSubject, role: 'quality' }).first('subject', 'name');
    if (!assignee) throw invalid([{ field: 'assignee', message: 'must be a quality engineer who has signed in to Fluxtrail' }]);
    await trx('signals').where({ id }).update({ assignee_subject: assignee.subject, assignee_name: assignee.name });
    await recordAudit(trx, {
      actor: actorOf(user), action: 'signal.assigned', entityType: 'signal', entityId: id,
      before: { assignee: before.assignee_subject }, after: { assignee: assignee.subject, assigneeName: assignee.name }, at: now,
    });
    return toSignalSummary(await findSignal(trx, id));
  });
}

/** Quality engineers who can take a signal. */
export async function assignableEngineers(db: Knex): Promise<Array<{ subject: string; name: string }>> {
  return db('users').where({ role: 'quality' }).orderBy('name').select('subject', 'name');
}
