import { Worker } from 'node:worker_threads';
import type { WrittenCsv } from './pack-csv.js';
import type { ResultsPage } from './results-page.js';
import type { WrittenFile } from './zip-file.js';
import type { FromZipWorker, PackZipInput, ToZipWorker } from './pack-zip-protocol.js';

// Plain JavaScript that registers tsx in the worker thread, then loads pack-zip-worker.ts.
const workerFile = new URL('./pack-zip-worker-start.mjs', import.meta.url);
/**
 * The worker's heap, kept small so the pack stays within its memory budget (400 MB for the whole
 * process): what it holds at once is a few pages of runs (about 5 MB each) and its modules, and
 * without a limit V8 lets garbage grow to well over 100 MB before collecting it.
 */
const workerHeap = { maxOldGenerationSizeMb: 64, maxYoungGenerationSizeMb: 16 };
/** How long an aborting worker may take to close its file before it is simply ended. */
const abortWaitMs = 5000;

/**
 * The pack's zip and its CSV, written by a worker thread (pack-zip-worker.ts) while this thread
 * writes the workbook. The worker reads the runs once and sends each page on for the Results
 * sheets; at most `pagesAhead` pages wait here, so memory stays flat. A failure in the worker is
 * thrown by the next call that waits on it.
 */
export class PackZipThread {
  private readonly worker: Worker;
  private readonly inbox: FromZipWorker[] = [];
  private arrived: (() => void) | undefined;
  private failure: Error | undefined;
  private ended = false;
  private readonly exited: Promise<void>;

  constructor(input: PackZipInput) {
    this.worker = new Worker(workerFile, { workerData: input, resourceLimits: workerHeap });
    this.worker.on('message', (message: FromZipWorker) => {
      this.inbox.push(message);
      this.arrived?.();
    });
    this.worker.on('error', (error) => {
      this.failure ??= error;
      this.arrived?.();
    });
    this.exited = new Promise((resolve) => {
      this.worker.once('exit', (code) => {
        if (!this.ended) this.failure ??= new Error(`the evidence pack's zip thread stopped (exit code ${code})`);
        this.arrived?.();
        resolve();
      });
    });
  }

  /** One product's Results pages, in run id order. */
  async *pages(): AsyncGenerator<ResultsPage> {
    for (;;) {
      const message = await this.expect('page', 'product-done');
      if (message.kind === 'product-done') return;
      this.send({ kind: 'page-taken' });
      yield message.page;
    }
  }

  /** After the last product's pages: the CSV as written into the zip. */
  async csvWritten(): Promise<WrittenCsv> {
    return (await this.expect('csv-done')).csv;
  }

  /** Adds the finished workbook and the manifest, closes the zip and waits for the thread to end. */
  async finish(workbook: { path: string; name: string }, manifest: { name: string; text: string }): Promise<WrittenFile> {
    this.send({ kind: 'finish', workbook, manifest });
    const { zip } = await this.expect('zip-done');
    this.ended = true;
    await this.exited;
    return zip;
  }

  /** Stops after a failure or a cancellation: the worker closes its file, then the thread is ended. */
  async abort(): Promise<void> {
    if (this.ended) return;
    this.ended = true;
    this.send({ kind: 'abort' });
    const closed = this.next('aborted').catch(() => undefined);
    await Promise.race([closed, this.exited, new Promise((resolve) => setTimeout(resolve, abortWaitMs).unref())]);
    await this.worker.terminate();
  }

  private send(message: ToZipWorker): void {
    this.worker.postMessage(message);
  }

  private async expect<K extends FromZipWorker['kind']>(...kinds: K[]): Promise<Extract<FromZipWorker, { kind: K }>> {
    const message = await this.next();
    if (!(kinds as string[]).includes(message.kind)) throw new Error(`the evidence pack's zip thread sent ${message.kind}, expected ${kinds.join(' or ')}`);
    return message as Extract<FromZipWorker, { kind: K }>;
  }

  private async next(until?: FromZipWorker['kind']): Promise<FromZipWorker> {
    for (;;) {
      const message = this.inbox.shift();
      if (message && (!until || message.kind === until)) return message;
      if (message) continue;
      if (this.failure) throw this.failure;
      await new Promise<void>((resolve) => { this.arrived = resolve; });
    }
  }
}
