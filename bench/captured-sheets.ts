// The cells an evidence pack wrote, kept for the benchmark's ceiling, which writes the same
// cells bare. Kept by column: numbers and times in arrays of doubles (8 bytes a cell, nothing
// for the garbage collector to trace), short repeated text once, so that millions of cells fit
// in memory. Text columns are arrays the collector does trace: they slow the turns that follow
// the capture a little (the second pack as much as the ceiling).
import { SheetColumns, type CellValue } from '../server/services/evidence/workbook/rolling-sheet.js';
import type { SheetShape } from '../server/services/evidence/workbook/pack-workbook.js';

type Column =
  | { kind: 'empty' }
  | { kind: 'number' | 'date'; cells: number[] } // NaN stands for an empty cell
  | { kind: 'any'; cells: CellValue[] };

const internedText = new Map<string, string>();
/** Verdicts, stations, badges: the same few words on every row, kept once. */
const intern = (text: string) => {
  if (text.length > 16) return text;
  const known = internedText.get(text);
  if (known !== undefined) return known;
  internedText.set(text, text);
  return text;
};

export class CapturedSheet {
  rows = 0;
  private readonly columns: Column[] = [];

  add(values: readonly CellValue[]): void {
    for (let i = 0; i < values.length; i++) this.put(i, values[i] ?? null);
    for (let i = values.length; i < this.columns.length; i++) this.put(i, null);
    this.rows += 1;
  }

  /** Row `r`'s cells as the pack wrote them (a new array; times as new Date objects, as the pack makes them). */
  row(r: number): CellValue[] {
    const values: CellValue[] = new Array(this.columns.length);
    for (let i = 0; i < this.columns.length; i++) values[i] = this.cell(i, r);
    return values;
  }

  cell(i: number, r: number): CellValue {
    const column = this.columns[i];
    if (!column || column.kind === 'empty') return null;
    if (column.kind === 'any') return column.cells[r] ?? null;
    const v = column.cells[r];
    if (Number.isNaN(v)) return null;
    return column.kind === 'date' ? new Date(v) : v;
  }

  private put(i: number, value: CellValue): void {
    let column = this.columns[i] ?? { kind: 'empty' };
    const kind = typeof value === 'number' ? 'number' : value instanceof Date ? 'date' : value === null ? null : 'any';
    if (column.kind === 'empty' && kind !== null) {
      column = kind === 'any' ? { kind, cells: new Array<CellValue>(this.rows).fill(null) } : { kind, cells: new Array<number>(this.rows).fill(NaN) };
    } else if (kind !== null && column.kind !== 'empty' && column.kind !== 'any' && column.kind !== kind) {
      column = { kind: 'any', cells: Array.from({ length: this.rows }, (_, r) => this.cell(i, r)) };
    }
    this.columns[i] = column;
    if (column.kind === 'empty') return;
    if (column.kind === 'any') column.cells.push(typeof value === 'string' ? intern(value) : value);
    else column.cells.push(value === null ? NaN : column.kind === 'date' ? (value as Date).getTime() : (value as number));
  }
}

/**
 * Runs `build` while every row the pack's sheets write is also kept, by sheet name. The rows are
 * taken from SheetColumns.writeRow, through which every sheet's rows pass, after it has made
 * them safe, so they are the cells as written.
 */
export async function captureSheets<T>(build: () => Promise<T>): Promise<{ result: T; sheets: Map<string, CapturedSheet> }> {
  const sheets = new Map<string, CapturedSheet>();
  const original = SheetColumns.prototype.writeRow;
  SheetColumns.prototype.writeRow = function writeRowKept(this: SheetColumns, sheet, values, shape: SheetShape) {
    original.call(this, sheet, values, shape);
    let kept = sheets.get(shape.name);
    if (!kept) sheets.set(shape.name, (kept = new CapturedSheet()));
    kept.add(values);
  };
  try {
    return { result: await build(), sheets };
  } finally {
    SheetColumns.prototype.writeRow = original;
  }
}
