import type { Knex } from 'knex';
import { createHash } from 'node:crypto';
import { mkdir, writeFile, access } from 'node:fs/promises';
import { join } from 'node:path';
import type { SessionUser } from '../../auth/session.js';
import { canonicalJson } from '../audit/hash.js';
import { sniffFileType, type UploadFile } from './open-upload-file.js';
import { surveyRuns } from './survey-runs.js';
import type { UploadOptions } from './upload-options.js';
import { runAndFinishPass, startPassInBackground } from './finish-upload-pass.js';
import { getUpload } from './upload-view.js';

/**
 * From this many data rows, or runs, on, the dry run goes on in the background and the client
 * polls: each run is checked through ingest (some milliseconds), so a thousand runs already take
 * longer than a request should wait.
 */
export const BACKGROUND_ROWS = 100_000;
export const BACKGROUND_RUNS = 1_000;
/** A pass whose heartbeat is older than this is taken to have died with its process. */
export const STALE_PASS_MS = 2 * 60_000;

export const uploadsFolder = (dataDir: string) => join(dataDir, 'uploads');

export function storedFile(dataDir: string, row: { file_sha256: string; file_type: 'csv' | 'xlsx'; options_json: string }): UploadFile {
  return { path: join(uploadsFolder(dataDir), `${row.file_sha256}.${row.file_type}`), fileType: row.file_type, options: JSON.parse(row.options_json) as UploadOptions };
}

export const isStale = (heartbeat: Date | null) => !heartbeat || Date.now() - heartbeat.getTime() > STALE_PASS_MS;

/** The same test in SQL: a pass that is checking or committing with no live process behind it. */
export const whereInterrupted = (q: Knex.QueryBuilder) => q.whereIn('status', ['checking', 'committing'])
  .where((h) => h.whereNull('heartbeat_at').orWhere('heartbeat_at', '<', new Date(Date.now() - STALE_PASS_MS)));

/**
 * Receives a file and dry-runs it. The file is kept under its SHA-256 (the commit reads it again)
 * and the upload is keyed by that hash and the reading options: the same file sent again answers
 * with the upload already made, and once committed it is never checked or stored again.
 */
export async function receiveUpload(db: Knex, dataDir: string, user: SessionUser, file: { name: string; bytes: Buffer }, options: UploadOptions) {
  const fileSha256 = createHash('sha256').update(file.bytes).digest('hex');
  const fileType = sniffFileType(file.bytes, file.name);
  const uploadKey = createHash('sha256').update(`${fileSha256}\u0000${canonicalJson(options)}`).digest('hex');
  const earlier = await db('uploads').where({ upload_key: uploadKey }).first('id', 'status', 'heartbeat_at');
  // A commit under way, or interrupted and waiting to be taken up again, is never checked afresh:
  // a new check would drop the report's record of the runs the commit has stored.
  const busy = earlier && (earlier.status === 'committing' || (earlier.status === 'checking' && !isStale(earlier.heartbeat_at)));
  if (earlier && (earlier.status === 'committed' || busy)) return { status: 200 as const, body: await getUpload(db, earlier.id) };

  const stored = { file_sha256: fileSha256, file_type: fileType, options_json: JSON.stringify(options) };
  const uploadFile = storedFile(dataDir, stored);
  await mkdir(uploadsFolder(dataDir), { recursive: true });
  // Content-addressed: a file already kept under its hash holds these very bytes.
  if (!(await access(uploadFile.path).then(() => true, () => false))) await writeFile(uploadFile.path, file.bytes);
  const { rowsTotal, runsTotal } = await surveyRuns(uploadFile);

  const fields = { status: 'checking', rows_total: rowsTotal, progress: 0, heartbeat_at: new Date(), error: null, file_name: file.name.slice(0, 255), uploaded_by: user.subject, uploaded_by_name: user.name };
  let id: number;
  if (earlier) {
    // Checked before but not committed: the plant's records may have changed since, so check again.
    id = earlier.id;
    await db('uploads').where({ id }).update(fields);
  } else {
    try {
      [id] = await db('uploads').insert({ ...fields, ...stored, upload_key: uploadKey, format: options.format, created_at: new Date() });
    } catch (error) {
      // The same file sent twice at once: the other request checks it.
      if ((error as { code?: string }).code !== 'ER_DUP_ENTRY') throw error;
      const other = await db('uploads').where({ upload_key: uploadKey }).first('id');
      return { status: 200 as const, body: await getUpload(db, other.id) };
    }
  }
  const actor = { name: user.name, role: user.role };
  if (rowsTotal >= BACKGROUND_ROWS || runsTotal >= BACKGROUND_RUNS) {
    startPassInBackground(db, id, uploadFile, 'check', actor);
    return { status: 202 as const, body: await getUpload(db, id) };
  }
  // A pass that failed is reported in the body (status 'failed', error), like one that failed in the background.
  await runAndFinishPass(db, id, uploadFile, 'check', actor);
  return { status: 201 as const, body: await getUpload(db, id) };
}
