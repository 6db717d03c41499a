import { mkdir, mkdtemp, rename, rm } from 'node:fs/promises';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import { countPack, packProducts, type PackTotals } from './pack-scope.js';
import { writePackContents } from './write-pack-contents.js';
import { buildManifest, manifestName, type PackedFile } from './pack-manifest.js';
import { ZipFile } from './zip-file.js';
import { sheetRowLimit } from './workbook/rolling-sheet.js';
import type { PackOrigin } from './workbook/pack-context.js';
import type { SheetShape } from './workbook/pack-workbook.js';

export const packsFolder = 'evidence-packs';

// The CSV is deflated as it is written, on zlib's thread pool beside the JavaScript that makes
// the rows. Level 1: the benchmark's 478 MB CSV became 31.4 MB in 1.4 s of CPU (level 3: 30.8 MB
// in 1.7 s).
const csvDeflateLevel = 1;

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
 * The CSV streams straight into the zip while the workbook is written beside it (the database
 * is read once for both); the workbook is then stored in the zip as it is, and the manifest
 * added. Every file is hashed as it is written. Work happens in a private folder and the zip
 * is moved into place only when whole, so a stopped build leaves nothing behind.
 */
export async function buildEvidencePack(db: Knex, filter: PackFilter, origin: PackOrigin, options: BuildOptions): Promise<BuiltPack> {
  const root = join(options.dataDir, packsFolder);
  await mkdir(root, { recursive: true });
  const work = await mkdtemp(join(root, `work-${origin.packId}-`));
  const zipPath = join(work, 'pack.zip');
  const pack = new ZipFile(zipPath, csvDeflateLevel);
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
    const written = await writePackContents({
      db, filter, products: await packProducts(db, filter), count, origin, rowCap: options.sheetRowCap ?? sheetRowLimit, advance,
      workbookPath: xlsxPath, csv: { name: csvName, entry: pack.openEntry(csvName) },
    });
    const files: PackedFile[] = [
      { name: xlsxName, bytes: written.workbook.bytes, sha256: written.workbook.sha256 },
      { name: csvName, bytes: written.csv.bytes, sha256: written.csv.sha256 },
    ];
    pack.addFile(xlsxPath, xlsxName, { store: true });
    pack.addText(manifestName, `${JSON.stringify(buildManifest(origin, filter, await count(), written.csv.rows, files), null, 2)}\n`);
    const zip = await pack.finish();
    const fileKey = `${packsFolder}/evidence-pack-${origin.packId}-${randomBytes(6).toString('hex')}.zip`;
    await rename(zipPath, join(options.dataDir, fileKey));
    return { fileKey, sizeBytes: zip.bytes, sha256: zip.sha256, rows: rowsDone, csvRows: written.csv.rows, sheets: written.sheets };
  } catch (error) {
    await pack.abort();
    throw error;
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
