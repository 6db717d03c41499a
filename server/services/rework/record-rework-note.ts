import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { recordAudit, type Actor } from '../audit/record-audit.js';
import type { ReworkNoteView } from '../motors/get-motor.js';

export type ReworkNoteInput = { serial: string; action: 'rework' | 'retest'; note: string; actor: Actor; at?: Date };

/**
 * Records what was done to a motor (rework) or that it must be tested again (retest), as an
 * audited annotation. It changes no run and no status: the next run's verdict does that.
 */
export async function recordReworkNote(db: Knex, input: ReworkNoteInput): Promise<ReworkNoteView> {
  return db.transaction(async (trx) => {
    const at = input.at ?? new Date();
    const motor = await trx('motors').where({ serial: input.serial }).first('id');
    if (!motor) throw notFound(`No motor with serial ${input.serial}.`);
    const [id] = await trx('rework_notes').insert({ motor_id: motor.id, action: input.action, note: input.note, recorded_by: input.actor.name, recorded_at: at });
    await recordAudit(trx, {
      actor: input.actor, action: input.action === 'rework' ? 'rework.recorded' : 'retest.requested',
      entityType: 'motor', entityId: input.serial, after: { noteId: Number(id), action: input.action, note: input.note }, at,
    });
    return { id: Number(id), action: input.action, note: input.note, recordedBy: input.actor.name, recordedAt: at.toISOString() };
  });
}
