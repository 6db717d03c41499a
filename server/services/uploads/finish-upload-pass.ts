import type { Knex } from 'knex';
import { AppError } from '../../errors.js';
import { recordAudit, type Actor } from '../audit/record-audit.js';
import { PassStopped, runUploadPass } from './run-upload-pass.js';
import type { UploadFile } from './open-upload-file.js';

type Counts = { rows_ok: number; rows_failed: number; runs_new: number; runs_stored: number; runs_duplicate: number; runs_invalid: number };

async function countOutcomes(db: Knex, uploadId: number): Promise<Counts> {
  const rows = await db('upload_runs').where({ upload_id: uploadId }).groupBy('outcome')
    .select('outcome').count({ runs: '*' }).sum({ rows: 'row_count' }) as Array<{ outcome: string; runs: number | string; rows: number | string }>;
  const of = (outcome: string) => rows.find((r) => r.outcome === outcome);
  const runs = (outcome: string) => Number(of(outcome)?.runs ?? 0);
  const rowsOf = (outcome: string) => Number(of(outcome)?.rows ?? 0);
  return {
    rows_ok: rowsOf('new') + rowsOf('stored') + rowsOf('duplicate'), rows_failed: rowsOf('invalid'),
    runs_new: runs('new'), runs_stored: runs('stored'), runs_duplicate: runs('duplicate'), runs_invalid: runs('invalid'),
  };
}

/** While a pass runs, it proves it is alive this often, even inside a long chunk or survey. */
const heartbeatMs = 20_000;

/**
 * Runs a pass and records how it ended. A commit ends in one transaction that marks the upload
 * committed and writes the audit event, so the trail names who loaded which file and what it held.
 * A pass that throws leaves the upload 'failed' with the reason; runs it had stored stay stored
 * (each was complete on its own) and a later commit takes the file up again without repeating them.
 * A pass stopped for a shutdown hands its upload back (no heartbeat): the next process to start
 * takes it up where it stopped (server/jobs/upload-passes.ts).
 */
export async function runAndFinishPass(db: Knex, uploadId: number, file: UploadFile, mode: 'check' | 'commit', actor: Actor, stop?: AbortSignal): Promise<void> {
  const mine = () => db('uploads').where({ id: uploadId, status: mode === 'check' ? 'checking' : 'committing' });
  const beat = setInterval(() => { void mine().update({ heartbeat_at: new Date() }).catch(() => undefined); }, heartbeatMs);
  beat.unref();
  try {
    await runUploadPass(db, uploadId, file, mode, stop);
    clearInterval(beat);
    await finishPass(db, uploadId, mode, actor);
  } catch (error) {
    clearInterval(beat);
    if (error instanceof PassStopped) {
      await mine().update({ heartbeat_at: null });
      return;
    }
    console.error(`upload ${uploadId}: ${mode} pass failed`, error);
    // Our own errors say what to do; anything else is logged, not shown.
    const reason = error instanceof AppError ? error.message : 'An unexpected error stopped this pass; it has been logged. Runs already stored stay stored; commit again to continue.';
    await db('uploads').where({ id: uploadId }).update({ status: 'failed', error: reason.slice(0, 2000) });
  }
}

async function finishPass(db: Knex, uploadId: number, mode: 'check' | 'commit', actor: Actor): Promise<void> {
  const counts = await countOutcomes(db, uploadId);
  if (mode === 'check') {
    await db('uploads').where({ id: uploadId }).update({ ...counts, status: 'dry-run', progress: 1, checked_at: new Date(), error: null });
    return;
  }
  await db.transaction(async (trx) => {
    const upload = await trx('uploads').where({ id: uploadId }).forUpdate().first('file_name', 'file_sha256', 'format', 'options_json');
    const at = new Date();
    await trx('uploads').where({ id: uploadId }).update({ ...counts, status: 'committed', progress: 1, committed_at: at, error: null });
    await recordAudit(trx, {
      actor, action: 'upload.commit', entityType: 'upload', entityId: uploadId, at,
      after: { fileName: upload.file_name, fileSha256: upload.file_sha256, options: JSON.parse(upload.options_json), runsStored: counts.runs_stored, runsDuplicate: counts.runs_duplicate, runsInvalid: counts.runs_invalid, rowsFailed: counts.rows_failed },
    });
  });
}

/** Background passes of this process, so that a shutdown can stop them cleanly. */
const running = new Set<{ stop: AbortController; done: Promise<void> }>();

/** Starts a pass without waiting for it (large files, every commit); its end is written to the upload row. */
export function startPassInBackground(db: Knex, uploadId: number, file: UploadFile, mode: 'check' | 'commit', actor: Actor): void {
  const pass = { stop: new AbortController(), done: Promise.resolve() };
  pass.done = runAndFinishPass(db, uploadId, file, mode, actor, pass.stop.signal)
    .catch((error: unknown) => console.error(`upload ${uploadId}: the end of the ${mode} pass could not be written`, error))
    .finally(() => running.delete(pass));
  running.add(pass);
}

/**
 * For a shutdown: each background pass of this process ends after the chunk it is in and hands its
 * upload back, instead of being cut off mid-chunk when the database pool closes.
 */
export async function stopUploadPasses(): Promise<void> {
  const passes = [...running];
  for (const pass of passes) pass.stop.abort();
  await Promise.all(passes.map((pass) => pass.done));
}
