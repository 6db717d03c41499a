import ExcelJS from 'exceljs';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { finished } from 'node:stream/promises';
import { join } from 'node:path';
import { buildEvidencePack } from '../server/services/evidence/build-evidence-pack.js';
import type { SheetShape } from '../server/services/evidence/workbook/pack-workbook.js';
import { appVersion } from '../server/services/evidence/app-version.js';
import { benchScale } from './dataset.js';
import type { BenchContext } from './harness.js';
import { round } from './stats.js';

const packLots = 100; // 100 lots × 1,000 motors = 100k motors × 40 results

/** Samples the resident set size while work runs; returns the peak in MB. */
function rssSampler() {
  let peak = process.memoryUsage().rss;
  const timer = setInterval(() => { peak = Math.max(peak, process.memoryUsage().rss); }, 50);
  return { stop: () => { clearInterval(timer); return round(peak / 1_048_576, 0); } };
}

/**
 * The ceiling, "exceljs writing the same cells bare": exceljs's streaming writer at its defaults
 * (no styles) writes every sheet the pack wrote, in the same order, with the same rows and columns
 * and the same number of filled cells per column, each holding the value the pack wrote first in
 * that column (numbers as numbers, times as dates, text as text); then a plain CSV file of as many
 * lines as the pack's CSV. No database, no hashing, no zip around the CSV.
 */
async function bareWrite(dir: string, sheets: readonly SheetShape[], csvRows: number): Promise<number> {
  const start = performance.now();
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: join(dir, 'bare.xlsx') });
  for (const shape of sheets) {
    const sheet = workbook.addWorksheet(shape.name);
    sheet.addRow(shape.headers).commit();
    const everyRow = Math.min(...shape.filled);
    for (let r = 0; r < shape.rows - 1; r++) {
      sheet.addRow(r < everyRow ? shape.samples : shape.samples.map((v, i) => (r < shape.filled[i] ? v : null))).commit();
    }
    sheet.commit();
  }
  await workbook.commit();
  const csv = createWriteStream(join(dir, 'bare.csv'));
  const time = new Date().toISOString();
  csv.write('serial,run_id,attempt,characteristic,value,unit,lsl,usl,verdict,station,operator_badge,started_at_utc\r\n');
  for (let line = 0; line < csvRows;) {
    let lines = '';
    for (const end = Math.min(csvRows, line + 40); line < end; line++) {
      lines += `BX${String(line % 100_000).padStart(8, '0')},3f2a5c1e-0000-4000-8000-000000000000,1,C${line % 40},100.123,V,90,110,pass,BENCH-S01,B-0001,${time}\r\n`;
    }
    if (!csv.write(lines)) await new Promise<void>((r) => csv.once('drain', () => r()));
  }
  csv.end();
  await finished(csv);
  return (performance.now() - start) / 1000;
}

/** An evidence pack of 100k motors × 40 results beside the bare write of the same sheets and CSV lines. */
export async function benchEvidencePack(ctx: BenchContext) {
  const dir = join('.data', 'bench-evidence');
  await rm(dir, { recursive: true, force: true });
  await mkdir(dir, { recursive: true });
  const lots = Array.from({ length: packLots }, (_, i) => `BL-${String(i).padStart(3, '0')}`);
  ctx.log(`evidence pack: ${packLots * benchScale.motorsPerLot} motors × 40 results…`);
  const memory = rssSampler();
  const start = performance.now();
  const pack = await buildEvidencePack(ctx.db, { lots }, { packId: 999_999, requestedBy: 'bench', requestedRole: 'auditor', requestedAt: new Date(), version: appVersion }, {
    dataDir: dir, onProgress: async () => undefined,
  });
  const packSeconds = (performance.now() - start) / 1000;
  const peakRssMb = memory.stop();
  ctx.log('evidence pack: the bare exceljs + CSV ceiling…');
  const bareSeconds = await bareWrite(dir, pack.sheets, pack.csvRows);
  await rm(dir, { recursive: true, force: true });
  return {
    motors: packLots * benchScale.motorsPerLot, rows: pack.rows, zipMb: round(pack.sizeBytes / 1_048_576, 1),
    sheets: pack.sheets.map((s) => `${s.name}: ${s.rows} × ${s.headers.length}`), csvRows: pack.csvRows,
    packSeconds: round(packSeconds, 1), bareWriteSeconds: round(bareSeconds, 1), ratioToBare: round(packSeconds / bareSeconds, 2),
    peakRssMb, targets: { ratioToBare: '≤ 1.5', peakRssMb: '≤ 400' },
  };
}
