import type { Knex } from 'knex';
import { invalid } from '../../errors.js';
import { revisionInForce, withLimits } from './limits-in-force.js';
import type { ApprovedRevision } from './reference-data.js';
import { judgeRun } from './judge-run.js';
import type { RunToStore } from './store-runs.js';

/**
 * For an ingest batch, with the approved revisions of the batch's products as read there:
 * makes sure each run is judged by the revision in force at its start. A run judged before an
 * approval that now applies to it is judged again here; one left with no revision in force is
 * refused, as it would have been had the approval come first. Returns the runs judged again.
 */
export async function confirmLimitsInForce(db: Knex, runs: RunToStore[], revisions: ReadonlyMap<number, ApprovedRevision[]>): Promise<RunToStore[]> {
  const judgedAgain: RunToStore[] = [];
  for (const run of runs) {
    const inForce = revisionInForce(revisions.get(run.product.id) ?? [], new Date(run.document.startedAt));
    if (inForce?.id === run.limitSet.id) continue;
    if (!inForce) {
      throw invalid([{ field: 'startedAt', message: `no approved limit revision of ${run.product.code} was in force at ${run.document.startedAt}` }]);
    }
    // An approved revision's limits never change, so any connection may read them.
    run.limitSet = await withLimits(db, inForce);
    run.judged = judgeRun(run.results, run.product, run.limitSet.limits);
    judgedAgain.push(run);
  }
  return judgedAgain;
}
