import type { Knex } from 'knex';
import { forgetReferenceData } from '../runs/reference-data.js';

/**
 * Runs a Setup change of what ingest caches (products, characteristics, stations, station-client
 * bindings) in one transaction, then drops this process's cache, so the very next ingest here
 * reads the change. After the commit, not before: forgotten earlier, a concurrent ingest could
 * cache the old rows again. Other app processes see the change when their short TTL runs out.
 */
export async function changeReferenceData<T>(db: Knex, change: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  const result = await db.transaction(change);
  forgetReferenceData();
  return result;
}
