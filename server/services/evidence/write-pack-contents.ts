import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import { packSerials, type PackProduct, type PackTotals } from './pack-scope.js';
import { PackCsv, type CharacteristicFacts, type WrittenCsv } from './pack-csv.js';
import type { WrittenFile, ZipEntry } from './zip-file.js';
import { PackWorkbook, type SheetShape } from './workbook/pack-workbook.js';
import type { PackOrigin, PassContext, SheetContext } from './workbook/pack-context.js';
import { openSummarySheet } from './workbook/summary-sheet.js';
import { writeMotorsSheet } from './workbook/motors-sheet.js';
import { writeResultsSheets } from './workbook/results-sheets.js';
import { writeLimitsSheet, writeStationsSheet } from './workbook/reference-sheets.js';
import { writeHoldsSheet, writeSignalsSheet } from './workbook/holds-signals-sheets.js';
import { auditEventIds, writeAuditExtractSheet } from './workbook/audit-extract-sheet.js';

export type ContentsInput = {
  db: Knex;
  filter: PackFilter;
  /** The pack's products, needed at once. */
  products: PackProduct[];
  /** Starts counting the pack (once) and gives the counts. */
  count: () => Promise<PackTotals>;
  origin: PackOrigin;
  rowCap: number;
  advance: (rows: number) => Promise<void>;
  workbookPath: string;
  csv: { name: string; entry: ZipEntry };
};

async function characteristicFacts(db: Knex): Promise<Map<number, CharacteristicFacts>> {
  const rows = (await db('characteristics').select('id', 'code', 'unit', 'sort_order')) as Array<{ id: number; code: string; unit: string; sort_order: number }>;
  return new Map(rows.map((c) => [Number(c.id), { code: c.code, unit: c.unit, sortOrder: Number(c.sort_order) }]));
}

/**
 * The workbook (to a file) and the CSV (into its zip entry) from one read of the database: the
 * Results sheets and the CSV are written from the same pages of runs. Sheets are written in tab
 * order, each finished before the next begins, so memory stays flat; Summary, the first tab, is
 * written last, as it carries the CSV's hash.
 */
export async function writePackContents(input: ContentsInput): Promise<{ csv: WrittenCsv; workbook: WrittenFile; sheets: SheetShape[] }> {
  const workbook = new PackWorkbook(input.workbookPath, { creator: `Fluxtrail ${input.origin.version}`, created: input.origin.requestedAt });
  try {
    const writeSummary = openSummarySheet(workbook);
    let serials: Promise<string[]> | undefined;
    const pass: PassContext = { ...input, workbook, serials: () => (serials ??= packSerials(input.db, input.filter)) };
    await writeMotorsSheet(pass);
    // Counting the pack and finding its audit events are work for MariaDB alone: they run beside
    // the Results pass, which keeps this process busy, rather than slowing the Motors sheet's reads.
    const totals = input.count();
    totals.catch(() => undefined); // awaited below; this only keeps an early failure from counting as unhandled
    const auditIds = auditEventIds(pass, totals);
    auditIds.catch(() => undefined); // as above
    try {
      const csv = new PackCsv(input.csv.entry, await characteristicFacts(input.db));
      await writeResultsSheets(pass, csv, input.products);
      const csvFile = csv.finish();
      const ctx: SheetContext = { ...pass, totals: await totals };
      await writeLimitsSheet(ctx);
      await writeStationsSheet(ctx);
      await writeHoldsSheet(ctx);
      await writeSignalsSheet(ctx);
      await writeAuditExtractSheet(ctx, await auditIds);
      await writeSummary(ctx, { name: input.csv.name, sha256: csvFile.sha256, rows: csvFile.rows });
      return { csv: csvFile, workbook: await workbook.finish(), sheets: workbook.shapes };
    } finally {
      await Promise.allSettled([totals, auditIds]);
    }
  } catch (error) {
    await workbook.abort();
    throw error;
  }
}
