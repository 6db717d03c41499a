import type ExcelJS from 'exceljs';
import type { PackWorkbook, SheetShape } from './pack-workbook.js';
import { sheetText } from './sheet-text.js';

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

type Style = Readonly<Partial<ExcelJS.Style>>;
const dateTimeStyle: Style = Object.freeze({ numFmt: formats.dateTime });
const rowStyle: Style = Object.freeze({});

/**
 * How a sheet's columns look and how a row is written into it. exceljs gives every new cell a
 * style object of its own, and its style registry knows a style again only by the object (a
 * WeakMap), so it would serialise a style per cell; one frozen style object per column, given to
 * each cell, is serialised once. A date in a column without a format gets the date-time format.
 */
export class SheetColumns {
  private readonly styles: Style[];

  constructor(readonly specs: readonly ColumnSpec[]) {
    this.styles = specs.map((c) => Object.freeze(c.numFmt ? { numFmt: c.numFmt } : {}));
  }

  /** Widths, formats and an autofilter over the header; writes nothing yet. */
  prepare(sheet: ExcelJS.Worksheet): void {
    sheet.columns = this.specs.map((c) => ({ width: c.width ?? Math.max(10, c.header.length + 2), style: c.numFmt ? { numFmt: c.numFmt } : {} }));
    sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: this.specs.length } };
  }

  writeHeader(sheet: ExcelJS.Worksheet): void {
    const header = sheet.addRow(this.specs.map((c) => sheetText(c.header)));
    header.font = { bold: true };
    header.commit();
  }

  /** A new, empty record of a sheet written with these columns. */
  shape(name: string): SheetShape {
    return { name, headers: this.specs.map((c) => c.header), rows: 1, samples: this.specs.map(() => null), filled: this.specs.map(() => 0) };
  }

  /** Writes a row, noting in `shape` what it held. `values` is the caller's own array: it is changed as it is written. */
  writeRow(sheet: ExcelJS.Worksheet, values: CellValue[], shape: SheetShape): void {
    for (let i = 0; i < values.length; i++) {
      const value = values[i];
      if (value === null || value === undefined) {
        // exceljs reads an array whose first element is undefined as sparse; null keeps columns aligned.
        values[i] = null;
        continue;
      }
      if (typeof value === 'string') values[i] = sheetText(value);
      if (shape.filled[i] === 0) shape.samples[i] = value;
      shape.filled[i] += 1;
    }
    const row = sheet.addRow(values);
    // Shared like the cells' styles: a row's own new style object would be serialised once per row.
    (row as unknown as { style: Style }).style = rowStyle;
    for (let i = 0; i < values.length; i++) {
      row.getCell(i + 1).style = values[i] instanceof Date && !this.specs[i].numFmt ? dateTimeStyle : this.styles[i];
    }
    row.commit();
    shape.rows += 1;
  }
}

/**
 * A streamed worksheet that continues on a numbered next sheet when it reaches `rowCap` rows.
 * Every part repeats the header, which is frozen, bold and carries an autofilter. Create it when
 * its rows are about to be written: exceljs opens the sheet's zip entry at once.
 */
export class RollingSheet {
  private sheet!: ExcelJS.Worksheet;
  private shape!: SheetShape;
  private part = 0;
  private readonly layout: SheetColumns;

  constructor(
    private readonly workbook: PackWorkbook,
    private readonly baseName: string,
    columns: readonly ColumnSpec[],
    private readonly rowCap: number,
  ) {
    if (rowCap < 2 || rowCap > sheetRowLimit) throw new Error(`rowCap must be between 2 and ${sheetRowLimit}`);
    this.layout = new SheetColumns(columns);
    this.open();
  }

  private open(): void {
    this.part += 1;
    this.shape = this.layout.shape(sheetName(this.baseName, this.part));
    this.sheet = this.workbook.addSheet(this.shape);
    this.layout.prepare(this.sheet);
    this.layout.writeHeader(this.sheet);
  }

  /** `values` is the caller's own array: it is changed as it is written. */
  addRow(values: CellValue[]): void {
    if (this.shape.rows >= this.rowCap) {
      this.sheet.commit();
      this.open();
    }
    this.layout.writeRow(this.sheet, values, this.shape);
  }

  /** Call between pages: waits while the zip is behind, so memory stays flat. */
  settle(): Promise<void> {
    return this.workbook.settle();
  }

  commit(): void {
    this.sheet.commit();
  }
}
