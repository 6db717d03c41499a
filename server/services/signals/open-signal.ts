import type { Knex } from 'knex';
import { recordAudit } from '../audit/record-audit.js';
import { notifySubscribers } from '../mail/signal-messages.js';
import type { SignalRule } from '../spc/chart-kinds.js';

export type NewSignal = {
  characteristicId: number; productId: number; controlLimitId: number; rule: SignalRule; lotId: number;
  firstRunId: number; patternFirstRunId: number; at: Date;
};

/**
 * Opens the signal of a new episode, audited, with its e-mails in the outbox. The unique episode
 * key (characteristic, rule, first run) turns a second attempt at the same episode into a
 * duplicate-key error for that one statement (InnoDB keeps the transaction), and the signal
 * already there is returned instead of a twin.
 */
export async function openSignal(trx: Knex.Transaction, signal: NewSignal): Promise<{ id: number; created: boolean }> {
  const episode = { characteristic_id: signal.characteristicId, rule: signal.rule, first_run_id: signal.firstRunId };
  let id: number;
  try {
    const [inserted] = await trx('signals').insert({
      ...episode, product_id: signal.productId, control_limit_id: signal.controlLimitId, lot_id: signal.lotId,
      pattern_first_run_id: signal.patternFirstRunId, status: 'open', opened_at: signal.at,
    });
    id = Number(inserted);
  } catch (error) {
    if ((error as { code?: string }).code !== 'ER_DUP_ENTRY') throw error;
    const existing = await trx('signals').where(episode).first('id');
    return { id: Number(existing.id), created: false };
  }
  await recordAudit(trx, {
    actor: { name: 'SPC evaluation', role: null }, action: 'signal.opened', entityType: 'signal', entityId: id,
    after: { rule: signal.rule, characteristicId: signal.characteristicId, lotId: signal.lotId, firstRunId: signal.firstRunId, controlLimitId: signal.controlLimitId },
    at: signal.at,
  });
  await notifySubscribers(trx, id, 'opened', signal.at);
  return { id, created: true };
}
