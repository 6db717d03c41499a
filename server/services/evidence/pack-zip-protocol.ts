import type { Config } from '../../config.js';
import type { PackFilter } from './pack-filter.js';
import type { WrittenCsv } from './pack-csv.js';
import type { ResultsPage } from './results-page.js';
import type { WrittenFile } from './zip-file.js';

// What the thread writing the workbook and the pack's zip thread (pack-zip-worker.ts) say to each other.

export type PackZipInput = {
  db: Config['db'];
  filter: PackFilter;
  zipPath: string;
  csvName: string;
  /** The pack's products in sheet order, each with its characteristic ids in column order. */
  products: Array<{ id: number; characteristicIds: number[] }>;
  /** Results pages the worker may send before the workbook's thread has taken them. */
  pagesAhead: number;
};

export type FromZipWorker =
  | { kind: 'page'; page: ResultsPage }
  | { kind: 'product-done' }
  | { kind: 'csv-done'; csv: WrittenCsv }
  | { kind: 'zip-done'; zip: WrittenFile }
  | { kind: 'aborted' };

export type ToZipWorker =
  | { kind: 'page-taken' }
  /** The rest of the pack: the finished workbook (stored as it is) and the manifest. */
  | { kind: 'finish'; workbook: { path: string; name: string }; manifest: { name: string; text: string } }
  | { kind: 'abort' };
