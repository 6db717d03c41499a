import type { Knex } from 'knex';
import { answerForRetry, type IngestOutcome } from './stored-run.js';
import { calibrationOkFor, storeRuns, transactionChannel, type RunToStore } from './store-runs.js';
import { statementPool } from '../../db/knex.js';
import { directTransaction } from '../../db/direct-transaction.js';
import { acceptsSeveralStatements, TransactionNeeded } from '../../db/statements.js';
import type { TestRunResponse } from '../../schemas/test-run.js';

/** A batch stays well inside one packet and one short transaction. */
const maxRunsPerBatch = 32;
const maxMeasurementsPerBatch = 4000;
/** How long a free writer waits for the stands it has just answered to post again. */
const gatherMs = 3;
/**
 * Batches written at once: while one waits for MariaDB, the next is built and sent, and reads and
 * locks its motors while the first commits. Measured on the benchmark's ingest (2 cores, one app
 * process): 0.63-0.71 of the raw ceiling with two, 0.58 with one, 0.62 with three (smaller batches).
 */
const maxBatchesInFlight = 2;
const peakWindowMs = 1000;

/** The most runs the writer has held at once (queued or being written) over the last second or two. */
class RecentPeak {
  private current = 0;
  private previous = 0;
  private windowStartMs = 0;

  note(count: number, nowMs: number): void {
    if (nowMs - this.windowStartMs > peakWindowMs) {
      this.previous = this.current;
      this.current = 0;
      this.windowStartMs = nowMs;
    }
    this.current = Math.max(this.current, count);
  }

  value(nowMs: number): number {
    this.note(0, nowMs);
    return Math.max(this.current, this.previous);
  }
}

type Pending = { run: RunToStore; resolve: (outcome: IngestOutcome) => void; reject: (error: unknown) => void };

/**
 * Writes checked runs to the database, batching those that arrive together: while batches are
 * being written (two at most) the next runs queue, and the queue is then written as one
 * transaction. Stands post concurrently, so under load each transaction carries several runs and
 * the rows every run touches (SPC state, display blocks, yield counters) are locked once per batch
 * instead of once per run. When fewer runs wait or are being written than the writer recently held
 * at once, it waits a few milliseconds for the stands it has just answered, so that batches stay
 * whole instead of alternating big and small; a single stand is never kept waiting. A serial or
 * runId already in a batch, or in one being written, waits for a later one, so attempts still
 * count in order. If a batch fails for any reason, it is rolled back and
 * its runs are stored one by one, so every run gets exactly the answer it would have had alone.
 */
class RunWriter {
  private readonly queue: Pending[] = [];
  private readonly peak = new RecentPeak();
  private batchesInFlight = 0;
  /**
   * Serials and runIds of the batches being written: a run of one of them waits for a later batch.
   * The serials of a batch are distinct, so there are as many serials as runs being written.
   */
  private readonly serialsInFlight = new Set<string>();
  private readonly runIdsInFlight = new Set<string>();
  private gatherTimer: NodeJS.Timeout | undefined;

  /** Writes go through the multi-statement pool beside the app's pool, where there is one. */
  private readonly db: Knex;

  constructor(db: Knex) {
    this.db = statementPool(db) ?? db;
  }

  store(run: RunToStore): Promise<IngestOutcome> {
    return new Promise((resolve, reject) => {
      this.queue.push({ run, resolve, reject });
      this.peak.note(this.queue.length + this.serialsInFlight.size, performance.now());
      this.writeNext();
    });
  }

  private writeNext(): void {
    if (this.batchesInFlight >= maxBatchesInFlight || this.queue.length === 0) return;
    if (this.queue.length + this.serialsInFlight.size < this.peak.value(performance.now())) {
      this.gatherTimer ??= setTimeout(() => this.writeNow(), gatherMs);
      return;
    }
    this.writeNow();
  }

  private writeNow(): void {
    clearTimeout(this.gatherTimer);
    this.gatherTimer = undefined;
    if (this.batchesInFlight >= maxBatchesInFlight || this.queue.length === 0) return;
    const batch = this.takeBatch();
    if (batch.length === 0) return; // every queued run waits for a batch in flight
    this.batchesInFlight++;
    for (const p of batch) {
      this.serialsInFlight.add(p.run.document.serial);
      this.runIdsInFlight.add(p.run.document.runId);
    }
    void this.write(batch).finally(() => {
      this.batchesInFlight--;
      for (const p of batch) {
        this.serialsInFlight.delete(p.run.document.serial);
        this.runIdsInFlight.delete(p.run.document.runId);
      }
      this.writeNext();
    });
    // More than a batch's worth was waiting: the other slot need not wait for the next post.
    if (this.batchesInFlight < maxBatchesInFlight && this.queue.length > 0) this.writeNow();
  }

  private takeBatch(): Pending[] {
    const batch: Pending[] = [];
    const serials = new Set<string>();
    const runIds = new Set<string>();
    let measurements = 0;
    for (let i = 0; i < this.queue.length && batch.length < maxRunsPerBatch;) {
      const { document, judged } = this.queue[i].run;
      const fits = batch.length === 0 || measurements + judged.results.length <= maxMeasurementsPerBatch;
      const taken = serials.has(document.serial) || runIds.has(document.runId) || this.serialsInFlight.has(document.serial) || this.runIdsInFlight.has(document.runId);
      if (!fits || taken) {
        // Its serial is passed over too: a later run of that serial must not get the earlier attempt.
        serials.add(document.serial);
        runIds.add(document.runId);
        i++;
        continue;
      }
      serials.add(document.serial);
      runIds.add(document.runId);
      measurements += judged.results.length;
      batch.push(...this.queue.splice(i, 1));
    }
    return batch;
  }

  private async write(batch: Pending[]): Promise<void> {
    if (batch.length > 1) {
      try {
        const answers = await storeInOneTransaction(this.db, batch.map((p) => p.run));
        batch.forEach((p, i) => p.resolve({ status: 201, body: answers[i] }));
        return;
      } catch {
        // Rolled back whole; each run is tried alone below and gets its own answer or error.
      }
    }
    for (const p of batch) {
      try {
        p.resolve(await storeAlone(this.db, p.run));
      } catch (error) {
        p.reject(error);
      }
    }
  }
}

/**
 * Runs in one transaction: driven by hand on a multi-statement pool (the usual case), or as a knex
 * transaction (a savepoint inside a caller's) when a run needs one (a calibration hold, an SPC
 * signal opening) or the pool takes one statement at a time.
 */
async function storeInOneTransaction(db: Knex, runs: RunToStore[]): Promise<TestRunResponse[]> {
  if (!db.isTransaction && acceptsSeveralStatements(db) && runs.every(calibrationOkFor)) {
    try {
      return await directTransaction(db, (send) => storeRuns({ db, trx: null, send }, runs));
    } catch (error) {
      // A signal opens: foreseen after the first round trip (rolled back at once), or met later.
      if (!(error instanceof TransactionNeeded)) throw error;
    }
  }
  return db.transaction((trx) => storeRuns(transactionChannel(trx), runs));
}

const writers = new WeakMap<Knex, RunWriter>();

/**
 * Stores one checked run and answers 201, or 200 for a retry of a stored run. Inside a caller's
 * transaction (uploads) the run is written there; otherwise it joins the pool's batch writer.
 */
export function storeCheckedRun(db: Knex, run: RunToStore): Promise<IngestOutcome> {
  if (db.isTransaction) return storeAlone(db, run);
  let writer = writers.get(db);
  if (!writer) {
    writer = new RunWriter(db);
    writers.set(db, writer);
  }
  return writer.store(run);
}

/** One run in its own transaction (a savepoint inside a caller's), with the retry answers. */
async function storeAlone(db: Knex, run: RunToStore): Promise<IngestOutcome> {
  for (let attempt = 1; ; attempt++) {
    try {
      const [body] = await storeInOneTransaction(db, [run]);
      return { status: 201, body };
    } catch (error) {
      if (!isRetryable(error)) throw error;
      // This runId is stored already (a retry, perhaps concurrent), or a deadlock between two first runs.
      const answer = await answerForRetry(db, run.document.runId, run.sha256);
      if (answer) return answer;
      if (attempt >= 3) throw error;
    }
  }
}

/** The runId taken (by an earlier or concurrent post), a serial created concurrently, or a deadlock. */
function isRetryable(error: unknown): boolean {
  const code = typeof error === 'object' && error !== null ? (error as { code?: string }).code : undefined;
  return code === 'ER_DUP_ENTRY' || code === 'ER_LOCK_DEADLOCK';
}
