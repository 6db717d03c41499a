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
import { captureSheets, type CapturedSheet } from './captured-sheets.js';

const packLots = 100; // 100 lots × 1,000 motors = 100k motors × 40 results

/** Samples the resident set size while work runs; returns the peak in MB. */
function rssSampler() {
  let peak = process.memoryUsage().rss;
  const timer = setInterval(() => { peak = Math.max(peak, process.memoryUsage().rss); }, 50);
  return { stop: () => { clearInterval(timer); return round(peak / 1_048_576, 0); } };
}

/**
 * The ceiling, "exceljs writing the same cells bare": exceljs's streaming writer at its defaults
 * (no styles) writes every sheet the pack wrote, in the same order, each row holding the cells the
 * pack wrote (kept from a second, untimed build of the same pack); then a plain CSV file of the
 * pack's measurement lines, built from the same cells (serial, run, attempt, value, verdict,
 * station, badge and time of each measured value; code and unit from the column's header). No
 * database, no styles or formats, no hashing, no zip around the CSV.
 */
async function bareWrite(dir: string, shapes: readonly SheetShape[], cells: ReadonlyMap<string, CapturedSheet>) {
  const start = performance.now();
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: join(dir, 'bare.xlsx') });
  for (const shape of shapes) {
    const sheet = workbook.addWorksheet(shape.name);
    sheet.addRow(shape.headers).commit();
    const rows = cells.get(shape.name);
    if (rows) for (let r = 0; r < rows.rows; r++) sheet.addRow(rows.row(r)).commit();
    sheet.commit();
  }
  await workbook.commit();
  const workbookDone = performance.now();
  const csvRows = await bareCsv(join(dir, 'bare.csv'), shapes, cells);
  const end = performance.now();
  return { seconds: (end - start) / 1000, workbookSeconds: (workbookDone - start) / 1000, csvSeconds: (end - workbookDone) / 1000, csvRows };
}

/** The Results sheets' measured values as CSV lines; limits, which the sheets do not carry, as constants. */
async function bareCsv(path: string, shapes: readonly SheetShape[], cells: ReadonlyMap<string, CapturedSheet>): Promise<number> {
  // Written in pieces of about 64 kB into a 1 MB buffer, so the file is written as fast as the disk takes it.
  const csv = createWriteStream(path, { highWaterMark: 1 << 20 });
  csv.write('serial,run_id,attempt,characteristic,value,unit,lsl,usl,verdict,station,operator_badge,started_at_utc\r\n');
  let lines = 0;
  let text = '';
  for (const shape of shapes.filter((s) => s.name.startsWith('Results '))) {
    const rows = cells.get(shape.name);
    if (!rows) continue;
    // Results columns: serial, run, attempt, started, station, calibration due, badge, program,
    // revision, verdict, then a value and a verdict column per characteristic ("CODE [unit]").
    const measured = shape.headers.slice(10).flatMap((h, i) => (i % 2 === 0 ? [{ at: 10 + i, ...parseHeader(h) }] : []));
    for (let r = 0; r < rows.rows; r++) {
      const head = `${rows.cell(0, r)},${rows.cell(1, r)},${rows.cell(2, r)},`;
      const tail = `,${rows.cell(4, r)},${rows.cell(6, r)},${(rows.cell(3, r) as Date).toISOString()}\r\n`;
      for (const m of measured) {
        const value = rows.cell(m.at, r);
        if (value === null) continue;
        text += `${head}${m.code},${value},${m.unit},90,110,${rows.cell(m.at + 1, r)}${tail}`;
        lines += 1;
      }
      if (text.length > 1 << 16) {
        const full = !csv.write(text);
        text = '';
        if (full) await new Promise<void>((resolve) => csv.once('drain', () => resolve()));
      }
    }
  }
  csv.write(text);
  csv.end();
  await finished(csv);
  return lines;
}

function parseHeader(header: string): { code: string; unit: string } {
  const match = /^(.*) \[(.*)\]$/.exec(header);
  if (!match) throw new Error(`not a measured column: ${header}`);
  return { code: match[1], unit: match[2] };
}

/** An evidence pack of 100k motors × 40 results beside the bare write of the same cells and CSV lines, in two alternating rounds. */
export async function benchEvidencePack(ctx: Pick<BenchContext, 'db' | 'log'>) {
  const dir = join('.data', 'bench-evidence');
  await rm(dir, { recursive: true, force: true });
  await mkdir(dir, { recursive: true });
  const lots = Array.from({ length: packLots }, (_, i) => `BL-${String(i).padStart(3, '0')}`);
  ctx.log(`evidence pack: ${packLots * benchScale.motorsPerLot} motors × 40 results…`);
  const origin = (packId: number) => ({ packId, requestedBy: 'bench', requestedRole: 'auditor' as const, requestedAt: new Date(), version: appVersion });
  const build = (packId: number) => buildEvidencePack(ctx.db, { lots }, origin(packId), { dataDir: dir, onProgress: async () => undefined });
  const timed = async <T>(work: () => Promise<T>) => {
    const start = performance.now();
    const value = await work();
    return { value, seconds: (performance.now() - start) / 1000 };
  };
  const memory = rssSampler();
  const first = await timed(() => build(999_999));
  const peakRssMb = memory.stop();
  const pack = first.value;
  ctx.log('evidence pack: the same pack again, untimed, keeping every cell it writes…');
  const kept = await captureSheets(() => build(999_998));
  // Pack and ceiling take turns, twice, so both meet the same moments of a machine whose speed drifts.
  ctx.log('evidence pack: the bare exceljs + CSV ceiling, the pack again, the ceiling again…');
  const bare = [await bareWrite(dir, pack.sheets, kept.sheets)];
  const second = await timed(() => build(999_997));
  bare.push(await bareWrite(dir, pack.sheets, kept.sheets));
  for (const b of bare) if (b.csvRows !== pack.csvRows) throw new Error(`the ceiling wrote ${b.csvRows} CSV lines, the pack ${pack.csvRows}`);
  const packSeconds = [first.seconds, second.seconds];
  const bareSeconds = bare.map((b) => b.seconds);
  const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);
  await rm(dir, { recursive: true, force: true });
  return {
    motors: packLots * benchScale.motorsPerLot, rows: pack.rows, zipMb: round(pack.sizeBytes / 1_048_576, 1),
    sheets: pack.sheets.map((s) => `${s.name}: ${s.rows} × ${s.headers.length}`), csvRows: pack.csvRows,
    packSeconds: packSeconds.map((v) => round(v, 1)), bareWriteSeconds: bareSeconds.map((v) => round(v, 1)),
    bareWorkbookSeconds: bare.map((b) => round(b.workbookSeconds, 1)), bareCsvSeconds: bare.map((b) => round(b.csvSeconds, 1)),
    ratioToBare: round(sum(packSeconds) / sum(bareSeconds), 2),
    peakRssMb, targets: { ratioToBare: '≤ 1.5', peakRssMb: '≤ 400' },
  };
}
