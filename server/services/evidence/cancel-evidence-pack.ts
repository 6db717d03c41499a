import type { Knex } from 'knex';
import { conflict, notFound } from '../../errors.js';
import { toPackView, type EvidencePackView, type ExportJobRow } from './pack-view.js';

/**
 * A queued pack is cancelled at once; a running one is asked to stop and its job ends itself at
 * the next page (see the job runner). The row lock keeps this from racing a worker's claim.
 */
export async function cancelEvidencePack(db: Knex, id: number): Promise<EvidencePackView> {
  return db.transaction(async (trx) => {
    const row = (await trx('export_jobs').where({ id }).forUpdate().first()) as ExportJobRow | undefined;
    if (!row) throw notFound(`No evidence pack ${id}.`);
    if (row.status === 'queued') {
      await trx('export_jobs').where({ id }).update({ status: 'cancelled', cancel_requested: true, finished_at: trx.fn.now(3) });
    } else if (row.status === 'running') {
      await trx('export_jobs').where({ id }).update({ cancel_requested: true });
    } else {
      throw conflict(`Evidence pack ${id} is already ${row.status}.`);
    }
    return toPackView((await trx('export_jobs').where({ id }).first()) as ExportJobRow);
  });
}
