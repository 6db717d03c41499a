import type { Knex } from 'knex';
import { signalsQuery, toSignalSummary, type SignalStatus } from './signal-rows.js';

export type SignalFilter = { status?: SignalStatus; product?: string; characteristicId?: number; limit?: number };

/** The inbox, newest first; each filter narrows it. */
export async function listSignals(db: Knex, filter: SignalFilter) {
  const query = signalsQuery(db).orderBy('signals.id', 'desc').limit(filter.limit ?? 200);
  if (filter.status) query.where('signals.status', filter.status);
  if (filter.product) query.where('products.code', filter.product);
  if (filter.characteristicId) query.where('signals.characteristic_id', filter.characteristicId);
  const counts: Array<{ status: SignalStatus; n: number }> = await db('signals').groupBy('status').select('status').count({ n: '*' });
  return {
    signals: (await query).map(toSignalSummary),
    counts: Object.fromEntries(counts.map((c) => [c.status, Number(c.n)])) as Partial<Record<SignalStatus, number>>,
  };
}
