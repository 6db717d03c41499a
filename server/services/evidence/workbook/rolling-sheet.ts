import type { XlsxPackage } from '../xlsx/xlsx-package.js';
import type { SheetWriter, SheetColumn } from '../xlsx/sheet-writer.js';
import type { CellValue } from '../xlsx/cell-xml.js';

export type { CellValue } from '../xlsx/cell-xml.js';
export type ColumnSpec = SheetColumn;

/** The most rows one worksheet may hold (the xlsx format's limit, header row included). */
export const sheetRowLimit = 1_048_576;
const sheetNameMax = 31;

/** A legal, unique-looking sheet name: "Results PM-150" then "Results PM-150 (2)", within 31 characters. */
export function sheetName(base: string, part: number): string {
  const suffix = part === 1 ? '' : ` (${part})`;
  const clean = base.replace(/[[\]:*?/\\]/g, '-');
  return `${clean.slice(0, sheetNameMax - suffix.length)}${suffix}`;
}

/**
 * A streamed worksheet that continues on a numbered next sheet when it reaches `rowCap` rows.
 * Every part repeats the header, which is frozen and carries an autofilter. `tab` places the
 * sheet among the workbook's tabs (see XlsxPackage).
 */
export class RollingSheet {
  private sheet!: SheetWriter;
  private part = 0;
  readonly names: string[] = [];

  constructor(
    private readonly workbook: XlsxPackage,
    private readonly baseName: string,
    private readonly columns: readonly ColumnSpec[],
    private readonly rowCap: number,
    private readonly place: { tab: number; selected?: boolean },
  ) {
    if (rowCap < 2 || rowCap > sheetRowLimit) throw new Error(`rowCap must be between 2 and ${sheetRowLimit}`);
    this.open();
  }

  private open(): void {
    this.part += 1;
    const name = sheetName(this.baseName, this.part);
    this.names.push(name);
    this.sheet = this.workbook.openSheet(name, this.columns, { tab: this.place.tab, selected: this.part === 1 && this.place.selected });
  }

  addRow(values: readonly CellValue[]): void {
    if (this.sheet.rowCount >= this.rowCap) {
      this.sheet.close();
      this.open();
    }
    this.sheet.addRow(values);
  }

  /** Call between pages: waits while the file is behind, so memory stays flat. */
  settle(): Promise<void> {
    return this.sheet.settle();
  }

  commit(): void {
    this.sheet.close();
  }
}
