import archiver from 'archiver';
import { createWriteStream } from 'node:fs';
import { mkdir, mkdtemp, rename, rm } from 'node:fs/promises';
import { finished } from 'node:stream/promises';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import { countPack } from './pack-scope.js';
import { writePackCsv } from './write-pack-csv.js';
import { writePackWorkbook } from './write-pack-workbook.js';
import { buildManifest, manifestName, type PackedFile } from './pack-manifest.js';
import { hashFile } from './hash-file.js';
import { sheetRowLimit } from './workbook/rolling-sheet.js';
import type { PackOrigin } from './workbook/pack-context.js';

export const packsFolder = 'evidence-packs';

export type BuildOptions = {
  dataDir: string;
  /** Rows per worksheet before it continues on a numbered sheet; lowered by tests to prove the split. */
  sheetRowCap?: number;
  /** Called as rows are written; throwing stops the build (a cancelled or lost job). */
  onProgress: (rowsDone: number, rowsTotal: number) => Promise<void>;
};

export type BuiltPack = { fileKey: string; sizeBytes: number; sha256: string; rows: number };

async function zipFiles(target: string, files: Array<{ path: string; name: string }>, manifest: string): Promise<void> {
  const out = createWriteStream(target);
  const archive = archiver('zip', { zlib: { level: 6 } });
  const failed = new Promise<never>((_, reject) => archive.on('error', reject));
  archive.pipe(out);
  for (const file of files) archive.file(file.path, { name: file.name });
  archive.append(manifest, { name: manifestName });
  await Promise.race([archive.finalize(), failed]);
  await finished(out);
}

/**
 * Builds one evidence pack: the CSV first (the Summary sheet carries its hash), then the
 * workbook, then a manifest hashing both, all zipped and hashed. Work happens in a private
 * folder and the zip is moved into place only when whole, so a stopped build leaves nothing behind.
 */
export async function buildEvidencePack(db: Knex, filter: PackFilter, origin: PackOrigin, options: BuildOptions): Promise<BuiltPack> {
  const root = join(options.dataDir, packsFolder);
  await mkdir(root, { recursive: true });
  const work = await mkdtemp(join(root, `work-${origin.packId}-`));
  try {
    const totals = await countPack(db, filter);
    const rowsTotal = totals.measurements + totals.motors + totals.runs;
    let rowsDone = 0;
    const advance = async (rows: number) => {
      rowsDone += rows;
      await options.onProgress(rowsDone, rowsTotal);
    };
    const csvName = `fluxtrail-pack-${origin.packId}-measurements.csv`;
    const xlsxName = `fluxtrail-pack-${origin.packId}-workbook.xlsx`;
    const csvPath = join(work, csvName);
    const xlsxPath = join(work, xlsxName);
    const csvRows = await writePackCsv(db, filter, csvPath, advance);
    const csvHash = await hashFile(csvPath);
    await writePackWorkbook(xlsxPath, {
      db, filter, totals, origin, rowCap: options.sheetRowCap ?? sheetRowLimit,
      csv: { name: csvName, sha256: csvHash.sha256, rows: csvRows }, advance,
    });
    const xlsxHash = await hashFile(xlsxPath);
    const files: PackedFile[] = [
      { name: xlsxName, bytes: xlsxHash.size, sha256: xlsxHash.sha256 },
      { name: csvName, bytes: csvHash.size, sha256: csvHash.sha256 },
    ];
    const manifest = `${JSON.stringify(buildManifest(origin, filter, totals, csvRows, files), null, 2)}\n`;
    const zipPath = join(work, 'pack.zip');
    await zipFiles(zipPath, [{ path: xlsxPath, name: xlsxName }, { path: csvPath, name: csvName }], manifest);
    const zipHash = await hashFile(zipPath);
    const fileKey = `${packsFolder}/evidence-pack-${origin.packId}-${randomBytes(6).toString('hex')}.zip`;
    await rename(zipPath, join(options.dataDir, fileKey));
    return { fileKey, sizeBytes: zipHash.size, sha256: zipHash.sha256, rows: rowsDone };
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
