import type { Knex } from 'knex';
import { conflict } from '../../errors.js';
import type { Actor } from '../audit/record-audit.js';
import { startPassInBackground } from './finish-upload-pass.js';
import { isStale, storedFile, whereInterrupted } from './receive-upload.js';
import { getUpload, uploadRow } from './upload-view.js';

/**
 * Commits a dry-run upload: every valid run through ingest, in the background, in chunks. The
 * upload moves to 'committing' in one guarded UPDATE, so two clicks or two processes start one
 * pass. A committed upload answers with its earlier result; a pass that died (no heartbeat for a
 * while) or failed is taken up again, and ingest's idempotency keeps any run from being stored twice.
 * A pass that died is also taken up without anyone asking, by the job loop (server/jobs/upload-passes.ts).
 */
export async function commitUpload(db: Knex, dataDir: string, id: number, actor: Actor) {
  const row = await uploadRow(db, id);
  if (row.status === 'committed') return { status: 200 as const, body: await getUpload(db, id) };
  if (row.status === 'checking' && !isStale(row.heartbeat_at)) throw conflict(`Upload ${id} is still being checked; commit it when its dry run is finished.`);
  if (!row.checked_at) throw conflict(`Upload ${id} has no finished dry run; send the file again to check it first.`);

  const taken = await db('uploads').where({ id })
    .where((q) => q.whereIn('status', ['dry-run', 'failed']).orWhere((s) => whereInterrupted(s)))
    .update({ status: 'committing', progress: 0, heartbeat_at: new Date(), error: null, committed_by_name: actor.name, committed_by_role: actor.role });
  if (taken === 1) startPassInBackground(db, id, storedFile(dataDir, row), 'commit', actor);
  // Not taken: another request is committing it right now; its progress is the answer.
  return { status: 202 as const, body: await getUpload(db, id) };
}
