import type { Knex } from 'knex';
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { Config } from '../config.js';
import { claimNextExportJob, failInterruptedExportJobs, runExportJob } from './export-jobs.js';
import { resumeInterruptedUploads } from './upload-passes.js';

export type JobsOptions = {
  db: Knex;
  config: Pick<Config, 'dataDir'>;
  pollMs?: number;
  /** A running job silent for longer than this belongs to a process that died. */
  staleSeconds?: number;
  heartbeatMs?: number;
  sheetRowCap?: number;
};

export type RunningJobs = { worker: string; stop(): Promise<void> };

/**
 * The background job loop of one app process: on start and every so often it fails packs whose
 * process died and takes up upload passes whose process died, then builds queued packs one at a
 * time. Stopping puts a job in progress back in the queue so the next process picks it up again.
 */
export function startJobs({ db, config, pollMs = 1000, staleSeconds = 60, heartbeatMs = 5000, sheetRowCap }: JobsOptions): RunningJobs {
  const worker = `${hostname()}:${process.pid}:${randomBytes(4).toString('hex')}`;
  const shutdown = new AbortController();
  let lastSweep = 0;
  let current: Promise<unknown> = Promise.resolve();
  let timer: NodeJS.Timeout | undefined;

  const tick = async () => {
    if (Date.now() - lastSweep >= staleSeconds * 1000) {
      lastSweep = Date.now();
      await failInterruptedExportJobs(db, config.dataDir, staleSeconds);
      await resumeInterruptedUploads(db, config.dataDir);
    }
    while (!shutdown.signal.aborted) {
      const job = await claimNextExportJob(db, worker);
      if (!job) return;
      // A shutdown during this run puts the job back in the queue (see runExportJob).
      await runExportJob(db, job, { dataDir: config.dataDir, sheetRowCap, heartbeatMs, signal: shutdown.signal });
    }
  };
  const loop = () => {
    current = tick().catch((error: unknown) => console.error('job loop', error)).finally(() => {
      if (!shutdown.signal.aborted) timer = setTimeout(loop, pollMs);
    });
  };
  loop();

  return {
    worker,
    async stop() {
      shutdown.abort();
      clearTimeout(timer);
      await current;
    },
  };
}
