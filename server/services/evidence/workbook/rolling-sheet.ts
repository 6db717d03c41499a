import type ExcelJS from 'exceljs';

export type CellValue = string | number | boolean | Date | null;
export type ColumnSpec = { header: string; width?: number; numFmt?: string };

/** The most rows one worksheet may hold (the xlsx format's limit, header row included). */
export const sheetRowLimit = 1_048_576;
const sheetNameMax = 31;

export const formats = {
  dateTime: 'yyyy-mm-dd hh:mm:ss',
  date: 'yyyy-mm-dd',
  integer: '0',
  measured: '0.000###',
} as const;

/** A legal, unique-looking sheet name: "Results PM-150" then "Results PM-150 (2)", within 31 characters. */
export function sheetName(base: string, part: number): string {
  const suffix = part === 1 ? '' : ` (${part})`;
  const clean = base.replace(/[[\]:*?/\\]/g, '-');
  return `${clean.slice(0, sheetNameMax - suffix.length)}${suffix}`;
}

/**
 * A streamed worksheet that continues on a numbered next sheet when it reaches `rowCap` rows.
 * Every part repeats the header, which is frozen and carries an autofilter.
 */
export class RollingSheet {
  private sheet!: ExcelJS.Worksheet;
  private rowsInSheet = 0;
  private part = 0;
  readonly names: string[] = [];

  constructor(
    private readonly workbook: ExcelJS.stream.xlsx.WorkbookWriter,
    private readonly baseName: string,
    private readonly columns: readonly ColumnSpec[],
    private readonly rowCap: number,
  ) {
    if (rowCap < 2 || rowCap > sheetRowLimit) throw new Error(`rowCap must be between 2 and ${sheetRowLimit}`);
    this.open();
  }

  private open(): void {
    this.part += 1;
    const name = sheetName(this.baseName, this.part);
    this.names.push(name);
    this.sheet = this.workbook.addWorksheet(name, { views: [{ state: 'frozen', ySplit: 1 }] });
    this.sheet.columns = this.columns.map((c) => ({ width: c.width ?? Math.max(10, c.header.length + 2), style: c.numFmt ? { numFmt: c.numFmt } : {} }));
    this.sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: this.columns.length } };
    const header = this.sheet.addRow(this.columns.map((c) => c.header));
    header.font = { bold: true };
    header.commit();
    this.rowsInSheet = 1;
  }

  addRow(values: readonly CellValue[]): void {
    if (this.rowsInSheet >= this.rowCap) {
      this.sheet.commit();
      this.open();
    }
    // exceljs reads an array whose first element is undefined as sparse; null keeps columns aligned.
    this.sheet.addRow(values.map((v) => (v === undefined ? null : v))).commit();
    this.rowsInSheet += 1;
  }

  commit(): void {
    this.sheet.commit();
  }
}
