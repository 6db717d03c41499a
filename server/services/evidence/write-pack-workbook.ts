import ExcelJS from 'exceljs';
import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import type { PackTotals } from './pack-scope.js';
import type { PackOrigin, SheetContext } from './workbook/pack-context.js';
import { writeSummarySheet } from './workbook/summary-sheet.js';
import { writeMotorsSheet } from './workbook/motors-sheet.js';
import { writeResultsSheets } from './workbook/results-sheets.js';
import { writeLimitsSheet, writeStationsSheet } from './workbook/reference-sheets.js';
import { writeHoldsSheet, writeSignalsSheet } from './workbook/holds-signals-sheets.js';
import { writeAuditExtractSheet } from './workbook/audit-extract-sheet.js';

export type WorkbookInput = {
  db: Knex;
  filter: PackFilter;
  totals: PackTotals;
  origin: PackOrigin;
  rowCap: number;
  csv: { name: string; sha256: string; rows: number };
  advance: (rows: number) => Promise<void>;
};

/**
 * The workbook, streamed sheet by sheet to disk with exceljs's WorkbookWriter: each sheet is
 * finished before the next begins, so memory stays flat. Text goes in as inline strings, never
 * as formulas.
 */
export async function writePackWorkbook(path: string, input: WorkbookInput): Promise<void> {
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: path, useStyles: true, useSharedStrings: false });
  workbook.creator = `Fluxtrail ${input.origin.version}`;
  workbook.created = input.origin.requestedAt;
  const ctx: SheetContext = { ...input, workbook };
  await writeSummarySheet(ctx, input.csv);
  await writeMotorsSheet(ctx);
  await writeResultsSheets(ctx);
  await writeLimitsSheet(ctx);
  await writeStationsSheet(ctx);
  await writeHoldsSheet(ctx);
  await writeSignalsSheet(ctx);
  await writeAuditExtractSheet(ctx);
  await workbook.commit();
}
