import type { Knex } from 'knex';
import { readdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { buildEvidencePack, packsFolder } from '../services/evidence/build-evidence-pack.js';
import { appVersion } from '../services/evidence/app-version.js';
import { parseStoredFilter, type ExportJobRow } from '../services/evidence/pack-view.js';

export type RunOptions = {
  dataDir: string;
  sheetRowCap?: number;
  /** How often the running job proves it is alive, even inside one long query. */
  heartbeatMs?: number;
  /** Aborted on a graceful shutdown: the job goes back to the queue instead of failing. */
  signal?: AbortSignal;
};

/** Thrown inside the build to stop it; the reason decides what the job row says afterwards. */
class JobStopped extends Error {
  constructor(readonly why: 'cancelled' | 'lost' | 'shutdown') { super(`export job stopped: ${why}`); }
}

/**
 * Takes the oldest queued job. FOR UPDATE SKIP LOCKED lets several app processes poll the same
 * queue: each locks a different row, and none waits for or repeats another's job.
 */
export async function claimNextExportJob(db: Knex, worker: string): Promise<ExportJobRow | undefined> {
  return db.transaction(async (trx) => {
    const job = (await trx('export_jobs').where({ status: 'queued' }).orderBy('id').limit(1).forUpdate().skipLocked().first()) as ExportJobRow | undefined;
    if (!job) return undefined;
    await trx('export_jobs').where({ id: job.id }).update({ status: 'running', worker, started_at: trx.fn.now(3), heartbeat_at: trx.fn.now(3) });
    return (await trx('export_jobs').where({ id: job.id }).first()) as ExportJobRow;
  });
}

/** Builds a claimed job's pack, reporting progress and heartbeats, and records how it ended. */
export async function runExportJob(db: Knex, job: ExportJobRow, options: RunOptions): Promise<ExportJobRow['status']> {
  const mine = () => db('export_jobs').where({ id: job.id, status: 'running', worker: job.worker });
  const beat = setInterval(() => { void mine().update({ heartbeat_at: db.fn.now(3) }).catch(() => undefined); }, options.heartbeatMs ?? 5000);
  beat.unref();
  let lastWrite = 0;
  const onProgress = async (rowsDone: number, rowsTotal: number) => {
    if (options.signal?.aborted) throw new JobStopped('shutdown');
    if (Date.now() - lastWrite < 250 && rowsDone < rowsTotal) return;
    lastWrite = Date.now();
    const progress = rowsTotal === 0 ? 1 : Math.min(1, rowsDone / rowsTotal);
    const updated = await mine().where({ cancel_requested: false })
      .update({ progress, rows_done: rowsDone, rows_total: rowsTotal, heartbeat_at: db.fn.now(3) });
    if (updated === 0) {
      const now = (await db('export_jobs').where({ id: job.id }).first('cancel_requested', 'status')) as Pick<ExportJobRow, 'cancel_requested' | 'status'>;
      throw new JobStopped(now.status === 'running' && now.cancel_requested ? 'cancelled' : 'lost');
    }
  };
  const origin = { packId: Number(job.id), requestedBy: job.requested_by_name, requestedRole: job.requested_by_role, requestedAt: new Date(job.created_at), version: appVersion };
  try {
    const built = await buildEvidencePack(db, parseStoredFilter(job.filter_json), origin, { dataDir: options.dataDir, sheetRowCap: options.sheetRowCap, onProgress });
    const finished = await mine().where({ cancel_requested: false }).update({
      status: 'done', progress: 1, rows_done: built.rows, rows_total: built.rows, file_key: built.fileKey,
      size_bytes: built.sizeBytes, sha256: built.sha256, finished_at: db.fn.now(3), heartbeat_at: db.fn.now(3),
    });
    if (finished === 1) return 'done';
    // Cancelled (or taken away) after the last page: the file must not outlive its job.
    await rm(join(options.dataDir, built.fileKey), { force: true });
    throw new JobStopped('cancelled');
  } catch (error) {
    return recordStop(db, job, error);
  } finally {
    clearInterval(beat);
  }
}

async function recordStop(db: Knex, job: ExportJobRow, error: unknown): Promise<ExportJobRow['status']> {
  const mine = db('export_jobs').where({ id: job.id, status: 'running', worker: job.worker });
  if (error instanceof JobStopped && error.why === 'lost') return 'failed';
  if (error instanceof JobStopped && error.why === 'shutdown') {
    await mine.update({ status: 'queued', worker: null, progress: 0, rows_done: 0, heartbeat_at: null, started_at: null });
    return 'queued';
  }
  if (error instanceof JobStopped) {
    await mine.update({ status: 'cancelled', finished_at: db.fn.now(3) });
    return 'cancelled';
  }
  console.error(`evidence pack ${job.id} failed`, error);
  const reason = error instanceof Error ? error.message : String(error);
  await mine.update({ status: 'failed', error: `The pack could not be built: ${reason}`.slice(0, 1000), finished_at: db.fn.now(3) });
  return 'failed';
}

export const interruptedReason = 'interrupted by a server restart';

/**
 * A running job whose heartbeat is older than `staleSeconds` has lost its process (crash or
 * restart). It is marked failed with the reason, never left running; its half-built files go.
 */
export async function failInterruptedExportJobs(db: Knex, dataDir: string, staleSeconds: number): Promise<number[]> {
  const stale = (await db('export_jobs').where({ status: 'running' })
    .where((q) => q.whereNull('heartbeat_at').orWhereRaw('heartbeat_at < NOW(3) - INTERVAL ? SECOND', [staleSeconds]))
    .pluck('id')) as number[];
  const failed: number[] = [];
  for (const id of stale) {
    const changed = await db('export_jobs').where({ id, status: 'running' })
      .where((q) => q.whereNull('heartbeat_at').orWhereRaw('heartbeat_at < NOW(3) - INTERVAL ? SECOND', [staleSeconds]))
      .update({ status: 'failed', error: interruptedReason, finished_at: db.fn.now(3) });
    if (changed === 1) failed.push(Number(id));
  }
  await removeWorkFolders(dataDir, failed);
  return failed;
}

async function removeWorkFolders(dataDir: string, ids: number[]): Promise<void> {
  if (ids.length === 0) return;
  const root = join(dataDir, packsFolder);
  const names = await readdir(root).catch(() => [] as string[]);
  const prefixes = ids.map((id) => `work-${id}-`);
  await Promise.all(names.filter((n) => prefixes.some((p) => n.startsWith(p))).map((n) => rm(join(root, n), { recursive: true, force: true })));
}
