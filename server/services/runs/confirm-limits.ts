import type { Knex } from 'knex';
import { invalid } from '../../errors.js';
import { readApprovedRevisions, revisionInForce, withLimits } from './limits-in-force.js';
import { judgeRun } from './judge-run.js';
import type { RunToStore } from './store-runs.js';

/**
 * Inside the ingest transaction: reads the approved revisions of the batch's products once and
 * makes sure each run is judged by the revision in force at its start. A run judged before an
 * approval that now applies to it is judged again here; one left with no revision in force is
 * refused, as it would have been had the approval come first.
 */
export async function confirmLimitsInForce(trx: Knex.Transaction, runs: RunToStore[]): Promise<void> {
  const revisions = await readApprovedRevisions(trx, [...new Set(runs.map((run) => run.product.id))]);
  for (const run of runs) {
    const inForce = revisionInForce(revisions.get(run.product.id) ?? [], new Date(run.document.startedAt));
    if (inForce?.id === run.limitSet.id) continue;
    if (!inForce) {
      throw invalid([{ field: 'startedAt', message: `no approved limit revision of ${run.product.code} was in force at ${run.document.startedAt}` }]);
    }
    run.limitSet = await withLimits(trx, inForce);
    run.judged = judgeRun(run.results, run.product, run.limitSet.limits);
  }
}
