import type { Knex } from 'knex';

export type OutgoingMail = { dedupeKey: string; to: string; subject: string; text: string; linkPath?: string };

/**
 * Writes a message to the outbox inside the caller's transaction, so it exists exactly when the
 * change it reports commits. The dedupe key makes a repeated enqueue of the same news a no-op.
 */
export async function enqueueMail(trx: Knex.Transaction, mail: OutgoingMail, at: Date): Promise<void> {
  await trx('mail_outbox')
    .insert({
      dedupe_key: mail.dedupeKey, to_address: mail.to, subject: mail.subject, text_body: mail.text,
      link_path: mail.linkPath ?? null, status: 'pending', attempts: 0, next_attempt_at: at, created_at: at,
    })
    .onConflict('dedupe_key')
    .ignore();
}
