import { mkdir, mkdtemp, rename, rm } from 'node:fs/promises';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import { countPack, packProducts, type PackTotals } from './pack-scope.js';
import { writePackContents } from './write-pack-contents.js';
import { buildManifest, manifestName, type PackedFile } from './pack-manifest.js';
import { PackZipThread } from './pack-zip-thread.js';
import { productPlans } from './workbook/results-sheets.js';
import { dbSettings } from '../../db/knex.js';
import { sheetRowLimit } from './workbook/rolling-sheet.js';
import type { PackOrigin } from './workbook/pack-context.js';
import type { SheetShape } from './workbook/pack-workbook.js';

export const packsFolder = 'evidence-packs';

/**
 * Results pages the zip thread may send ahead of the workbook (500 runs, about 300 kB each): room
 * to go on with the CSV while the workbook's thread is busy elsewhere, and a bound (about 2.4 MB)
 * on what waits in memory. At 24 the benchmark's peak came to 397 MB of the 400 allowed.
 */
const pagesAhead = 8;

export type BuildOptions = {
  dataDir: string;
  /** Rows per worksheet before it continues on a numbered sheet; lowered by tests to prove the split. */
  sheetRowCap?: number;
  /** Called as rows are written; throwing stops the build (a cancelled or lost job). */
  onProgress: (rowsDone: number, rowsTotal: number) => Promise<void>;
};

export type BuiltPack = {
  fileKey: string; sizeBytes: number; sha256: string; rows: number;
  /** Lines of the CSV (without header) and what each worksheet held, in tab order. */
  csvRows: number; sheets: SheetShape[];
};

/**
 * Builds one evidence pack: a zip of the workbook, the long CSV and a manifest hashing both.
 * A worker thread (PackZipThread) reads the runs and streams the CSV straight into the zip while
 * this thread writes the workbook beside it from the same read; the workbook is then stored in
 * the zip as it is, and the manifest added. Every file is hashed as it is written. Work happens in
 * a private folder and the zip is moved into place only when whole, so a stopped build leaves
 * nothing behind.
 */
export async function buildEvidencePack(db: Knex, filter: PackFilter, origin: PackOrigin, options: BuildOptions): Promise<BuiltPack> {
  const root = join(options.dataDir, packsFolder);
  await mkdir(root, { recursive: true });
  const work = await mkdtemp(join(root, `work-${origin.packId}-`));
  const zipPath = join(work, 'pack.zip');
  let zip: PackZipThread | undefined;
  try {
    // Counting takes a while on a large pack: it runs beside the Results pass (see
    // writePackContents), and progress is reported once there is a total to report against.
    let counting: Promise<PackTotals> | undefined;
    let rowsTotal: number | undefined;
    const count = () => {
      if (!counting) {
        counting = countPack(db, filter);
        counting.then((t) => { rowsTotal = t.measurements + t.motors + t.runs; }, () => undefined);
      }
      return counting;
    };
    let rowsDone = 0;
    const advance = async (rows: number) => {
      rowsDone += rows;
      if (rowsTotal !== undefined) await options.onProgress(rowsDone, rowsTotal);
    };
    const csvName = `fluxtrail-pack-${origin.packId}-measurements.csv`;
    const xlsxName = `fluxtrail-pack-${origin.packId}-workbook.xlsx`;
    const xlsxPath = join(work, xlsxName);
    const plans = await productPlans(db, await packProducts(db, filter));
    zip = new PackZipThread({
      db: dbSettings(db), filter, zipPath, csvName, pagesAhead,
      products: plans.map((p) => ({ id: p.product.id, characteristicIds: p.characteristics.map((c) => c.id) })),
    });
    const written = await writePackContents({
      db, filter, plans, count, origin, rowCap: options.sheetRowCap ?? sheetRowLimit, advance, workbookPath: xlsxPath, zip, csvName,
    });
    const files: PackedFile[] = [
      { name: xlsxName, bytes: written.workbook.bytes, sha256: written.workbook.sha256 },
      { name: csvName, bytes: written.csv.bytes, sha256: written.csv.sha256 },
    ];
    const manifest = `${JSON.stringify(buildManifest(origin, filter, await count(), written.csv.rows, files), null, 2)}\n`;
    const packed = await zip.finish({ path: xlsxPath, name: xlsxName }, { name: manifestName, text: manifest });
    const fileKey = `${packsFolder}/evidence-pack-${origin.packId}-${randomBytes(6).toString('hex')}.zip`;
    await rename(zipPath, join(options.dataDir, fileKey));
    return { fileKey, sizeBytes: packed.bytes, sha256: packed.sha256, rows: rowsDone, csvRows: written.csv.rows, sheets: written.sheets };
  } catch (error) {
    await zip?.abort();
    throw error;
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
