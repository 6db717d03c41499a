import ExcelJS from 'exceljs';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { finished } from 'node:stream/promises';
import { join } from 'node:path';
import { buildEvidencePack } from '../server/services/evidence/build-evidence-pack.js';
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

/** The ceiling: exceljs's streaming writer and a plain CSV stream writing the same cells, no database. */
async function bareWrite(dir: string, motors: number, characteristics: number): Promise<number> {
  const start = performance.now();
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: join(dir, 'bare.xlsx'), useSharedStrings: false });
  const motorsSheet = workbook.addWorksheet('Motors');
  const resultsSheet = workbook.addWorksheet('Results');
  const csv = createWriteStream(join(dir, 'bare.csv'));
  const time = new Date();
  for (let m = 0; m < motors; m++) {
    const serial = `BX${String(Math.floor(m / 1000)).padStart(3, '0')}-${String(m % 1000).padStart(5, '0')}`;
    motorsSheet.addRow([serial, 'BENCH-PM', 'BL-000', 'passed', 1, time]).commit();
    const row: Array<string | number | Date> = [serial, 'run', 1, time, 'BENCH-S01', time, 'B-0001', 'bench-1', 1, 'pass'];
    for (let c = 0; c < characteristics; c++) row.push(100.123, 'pass');
    resultsSheet.addRow(row).commit();
    let lines = '';
    for (let c = 0; c < characteristics; c++) lines += `${serial},run,1,C${c},100.123,V,90,110,pass,BENCH-S01,B-0001,${time.toISOString()}\n`;
    if (!csv.write(lines)) await new Promise<void>((r) => csv.once('drain', () => r()));
  }
  motorsSheet.commit();
  resultsSheet.commit();
  await workbook.commit();
  csv.end();
  await finished(csv);
  return (performance.now() - start) / 1000;
}

/** An evidence pack of 100k motors × 40 results beside the bare writes of the same cells. */
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
  const bareSeconds = await bareWrite(dir, packLots * benchScale.motorsPerLot, benchScale.characteristics);
  await rm(dir, { recursive: true, force: true });
  return {
    motors: packLots * benchScale.motorsPerLot, rows: pack.rows, zipMb: round(pack.sizeBytes / 1_048_576, 1),
    packSeconds: round(packSeconds, 1), bareWriteSeconds: round(bareSeconds, 1), ratioToBare: round(packSeconds / bareSeconds, 2),
    peakRssMb, targets: { ratioToBare: '≤ 1.5', peakRssMb: '≤ 400' },
  };
}
