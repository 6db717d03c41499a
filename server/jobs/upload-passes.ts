import type { Knex } from 'knex';
import { access } from 'node:fs/promises';
import { startPassInBackground } from '../services/uploads/finish-upload-pass.js';
import { storedFile, whereInterrupted } from '../services/uploads/receive-upload.js';
import type { UploadRow } from '../services/uploads/upload-view.js';

export const uploadFileGoneReason = 'Interrupted by a server restart, and the stored file is gone; send the file again.';

/**
 * Takes up the uploads whose background pass lost its process: handed back by a shutdown, or with a
 * heartbeat older than STALE_PASS_MS after a crash. Each is claimed by one process (a guarded
 * UPDATE of its heartbeat) and its pass started again from the stored file. A commit goes on where
 * it stopped: the runs it stored keep their place in the report, ingest's idempotency answers for
 * the rest, and the audit event is written once, in the name of the person who asked for the
 * commit. An upload whose stored file is gone is marked failed with that reason, never left
 * checking or committing. Returns the ids taken up and the ids failed.
 */
export async function resumeInterruptedUploads(db: Knex, dataDir: string): Promise<{ resumed: number[]; failed: number[] }> {
  const candidates = (await whereInterrupted(db('uploads')).orderBy('id')) as UploadRow[];
  const resumed: number[] = [];
  const failed: number[] = [];
  for (const row of candidates) {
    const claimed = await whereInterrupted(db('uploads').where({ id: row.id, status: row.status })).update({ heartbeat_at: new Date() });
    if (claimed !== 1) continue; // another process took it first
    const file = storedFile(dataDir, row);
    if (!(await access(file.path).then(() => true, () => false))) {
      await db('uploads').where({ id: row.id }).update({ status: 'failed', error: uploadFileGoneReason });
      failed.push(row.id);
      continue;
    }
    const mode = row.status === 'committing' ? 'commit' : 'check';
    const actor = mode === 'commit' ? { name: row.committed_by_name ?? row.uploaded_by_name, role: row.committed_by_role } : { name: row.uploaded_by_name, role: null };
    startPassInBackground(db, row.id, file, mode, actor);
    resumed.push(row.id);
  }
  return { resumed, failed };
}
