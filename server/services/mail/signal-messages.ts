import type { Knex } from 'knex';
import { describeSignalRule } from '../spc/describe-signal-rule.js';
import type { SignalRule } from '../spc/chart-kinds.js';
import { subscribersOf } from '../signals/subscriptions.js';
import { enqueueMail } from './enqueue-mail.js';

export type SignalNews = 'opened' | 'contained';

type SignalFacts = { id: number; rule: string; product_id: number; product_code: string; characteristic_name: string; unit: string; lot_code: string };

/**
 * Tells every engineer subscribed to the signal's product, through the outbox in the caller's
 * transaction. One message per person and piece of news (the dedupe key), however often asked.
 */
export async function notifySubscribers(trx: Knex.Transaction, signalId: number, news: SignalNews, at: Date, detail = ''): Promise<void> {
  const facts: SignalFacts | undefined = await trx('signals')
    .join('products', 'products.id', 'signals.product_id')
    .join('characteristics', 'characteristics.id', 'signals.characteristic_id')
    .join('lots', 'lots.id', 'signals.lot_id')
    .where('signals.id', signalId)
    .first('signals.id', 'signals.rule', 'signals.product_id', 'products.code as product_code',
      'characteristics.name as characteristic_name', 'characteristics.unit', 'lots.code as lot_code');
  if (!facts) return;
  const subscribers = await subscribersOf(trx, facts.product_id);
  const subject = news === 'opened'
    ? `Signal ${facts.id} opened: ${facts.product_code} ${facts.characteristic_name}, lot ${facts.lot_code}`
    : `Signal ${facts.id} contained: ${facts.product_code} ${facts.characteristic_name}, lot ${facts.lot_code}`;
  const text = [
    news === 'opened' ? 'A control chart rule was broken.' : 'The motors affected by this signal are now on hold.',
    '',
    `Product: ${facts.product_code}`,
    `Characteristic: ${facts.characteristic_name} (${facts.unit})`,
    `Lot: ${facts.lot_code}`,
    `Rule: ${describeSignalRule(facts.rule as SignalRule)}`,
    ...(detail ? ['', detail] : []),
  ].join('\n');
  for (const subscriber of subscribers) {
    await enqueueMail(trx, {
      dedupeKey: `signal:${facts.id}:${news}:${subscriber.subject}`, to: subscriber.email, subject, text, linkPath: `/signals/${facts.id}`,
    }, at);
  }
}
