import type { Knex } from 'knex';
import type { Config } from '../config.js';
import { smtpTransport, type MailTransport } from '../services/mail/transport.js';

type OutboxRow = { id: number; dedupe_key: string; to_address: string; subject: string; text_body: string; link_path: string | null; attempts: number };

export type DeliveryOptions = { from: string; publicUrl: string; now?: Date; batch?: number };
export type DeliveryReport = { sent: number; failed: number };

/** 30 s, 1 min, 2 min … capped at 15 min: a relay that is down is retried for as long as it takes. */
export function retryDelayMs(attempts: number): number {
  return Math.min(15 * 60_000, 30_000 * 2 ** Math.max(0, attempts - 1));
}

/**
 * Sends what is due, one row per transaction: the row is claimed FOR UPDATE SKIP LOCKED (another
 * process passes it by), handed to SMTP, and marked sent only after the server accepted it, all
 * before the lock is let go — so no two senders send it. A refusal or a dead relay leaves it
 * pending with the error and a later next_attempt_at.
 */
export async function deliverPendingMail(db: Knex, transport: MailTransport, options: DeliveryOptions): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: 0, failed: 0 };
  const batch = options.batch ?? 50;
  for (let i = 0; i < batch; i++) {
    const outcome = await db.transaction(async (trx) => {
      const now = options.now ?? new Date();
      const row: OutboxRow | undefined = await trx('mail_outbox')
        .where({ status: 'pending' }).andWhere('next_attempt_at', '<=', now)
        .orderBy('next_attempt_at').orderBy('id').limit(1).forUpdate().skipLocked().first();
      if (!row) return 'none';
      try {
        await transport.send({
          from: options.from, to: row.to_address, subject: row.subject,
          text: row.link_path ? `${row.text_body}\n\nOpen it in Fluxtrail: ${options.publicUrl}${row.link_path}\n` : row.text_body,
          messageId: `<${row.dedupe_key.replace(/[^A-Za-z0-9.-]/g, '.')}@fluxtrail>`,
        });
      } catch (error) {
        await trx('mail_outbox').where({ id: row.id }).update({
          attempts: row.attempts + 1, last_error: String((error as Error).message ?? error).slice(0, 1000),
          next_attempt_at: new Date(now.getTime() + retryDelayMs(row.attempts + 1)),
        });
        return 'failed';
      }
      await trx('mail_outbox').where({ id: row.id }).update({ status: 'sent', attempts: row.attempts + 1, sent_at: new Date(), last_error: null });
      return 'sent';
    });
    if (outcome === 'none') break;
    report[outcome] += 1;
  }
  return report;
}

/** Polls the outbox every few seconds until stopped. */
export function startMailOutbox({ db, config }: { db: Knex; config: Config }, intervalMs = 5_000): { stop(): Promise<void> } {
  const transport = smtpTransport(config.smtp);
  let running: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    running = running.then(() => deliverPendingMail(db, transport, { from: config.smtp.from, publicUrl: config.publicUrl }))
      .catch((error: unknown) => console.error('mail outbox:', error));
  }, intervalMs);
  return {
    async stop() {
      clearInterval(timer);
      await running;
      transport.close();
    },
  };
}
