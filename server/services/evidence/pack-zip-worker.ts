// The pack's zip, written in a worker thread (started by PackZipThread): it reads the pack's runs
// and measurements, writes the long CSV into the zip (deflated and hashed on the way) and hands
// each page of runs to the workbook's thread for the Results sheets. Reading 4M measurements and
// making the CSV's lines is as much work as writing the Results sheets; on two cores the two run
// side by side instead of one after the other on one thread.
import { parentPort, workerData } from 'node:worker_threads';
import type { Knex } from 'knex';
import { createDb } from '../../db/knex.js';
import { PackCsv, type CharacteristicFacts, type WrittenCsv } from './pack-csv.js';
import { eachRunPage } from './read-pack-runs.js';
import { toResultsPage, VerdictCodes } from './results-page.js';
import { ZipFile } from './zip-file.js';
import type { FromZipWorker, PackZipInput, ToZipWorker } from './pack-zip-protocol.js';

// Level 1: the benchmark's 478 MB CSV became 31.4 MB in 1.4 s of CPU (level 3: 30.8 MB in 1.7 s).
const csvDeflateLevel = 1;

const input = workerData as PackZipInput;
const port = parentPort!;
const post = (message: FromZipWorker, transfer: ArrayBuffer[] = []) => port.postMessage(message, transfer);

const zip = new ZipFile(input.zipPath, csvDeflateLevel);
// Three pages read ahead, each on a pooled connection, beside the connection lent for measurements.
const db = createDb({ ...input.db, poolMax: 6 });

let room = input.pagesAhead;
let roomMade: (() => void) | undefined;
let aborted = false;
let finishAsked: (request: Extract<ToZipWorker, { kind: 'finish' }>) => void = () => undefined;
const finishRequest = new Promise<Extract<ToZipWorker, { kind: 'finish' }>>((resolve) => { finishAsked = resolve; });

port.on('message', (message: ToZipWorker) => {
  if (message.kind === 'page-taken') {
    room += 1;
    roomMade?.();
  } else if (message.kind === 'finish') {
    finishAsked(message);
  } else {
    aborted = true;
    // The file is closed here; the thread itself is then ended by its starter.
    void zip.abort().then(() => post({ kind: 'aborted' }));
  }
});

/** Waits until the workbook's thread has room for one more page, so pages never pile up there. */
async function waitForRoom(): Promise<void> {
  while (room === 0) await new Promise<void>((resolve) => { roomMade = resolve; });
  room -= 1;
}

async function characteristicFacts(knex: Knex): Promise<Map<number, CharacteristicFacts>> {
  const rows = (await knex('characteristics').select('id', 'code', 'unit', 'sort_order')) as Array<{ id: number; code: string; unit: string; sort_order: number }>;
  return new Map(rows.map((c) => [Number(c.id), { code: c.code, unit: c.unit, sortOrder: Number(c.sort_order) }]));
}

/** One read of the runs, product by product, feeds both the CSV and the Results pages. */
async function writeCsv(): Promise<WrittenCsv> {
  const csv = new PackCsv(zip.openEntry(input.csvName), await characteristicFacts(db));
  const verdicts = new VerdictCodes();
  for (const product of input.products) {
    const column = new Map(product.characteristicIds.map((id, index) => [id, index]));
    await eachRunPage(db, input.filter, { productId: product.id }, async (runs) => {
      for (const run of runs) csv.addRun(run);
      const page = toResultsPage(runs, column, verdicts);
      await waitForRoom();
      post({ kind: 'page', page }, [page.values.buffer as ArrayBuffer, page.verdicts.buffer as ArrayBuffer]);
      await csv.settle();
    });
    post({ kind: 'product-done' });
  }
  return csv.finish();
}

async function writePack(): Promise<void> {
  try {
    post({ kind: 'csv-done', csv: await writeCsv() });
  } finally {
    await db.destroy();
  }
  const { workbook, manifest } = await finishRequest;
  zip.addFile(workbook.path, workbook.name, { store: true });
  zip.addText(manifest.name, manifest.text);
  post({ kind: 'zip-done', zip: await zip.finish() });
  // Listening to the port keeps the thread alive; done, it may end.
  port.unref();
}

writePack().catch((error: unknown) => {
  // Thrown again, it reaches the starter as the worker's 'error' event; after an abort it is only the echo of it.
  if (!aborted) throw error;
});
