import ExcelJS from 'exceljs';
import type { Cell, SheetRow } from './csv-records.js';

/**
 * Streams the first worksheet of a workbook row by row (exceljs' streaming reader), so a sheet of
 * a million rows never sits in memory as a whole. Row numbers are the sheet's own. Styles are not
 * read, so a date-formatted cell arrives as its serial number and is refused where a date-time is
 * expected: a spreadsheet date carries no offset, and guessing the plant's zone could shift it.
 */
export async function* xlsxRecords(path: string): AsyncGenerator<SheetRow> {
  const workbook = new ExcelJS.stream.xlsx.WorkbookReader(path, { worksheets: 'emit', sharedStrings: 'cache', hyperlinks: 'ignore', styles: 'ignore', entries: 'ignore' });
  for await (const worksheet of workbook) {
    for await (const row of worksheet) {
      const values = Array.isArray(row.values) ? row.values.slice(1) : [];
      const cells = Array.from({ length: values.length }, (_, i) => cellOf(values[i]));
      if (cells.some((c) => c !== '')) yield { row: row.number, cells };
    }
    return; // only the first worksheet holds results; others (notes, charts' data) are not read
  }
}

function cellOf(value: ExcelJS.CellValue | undefined): Cell {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return value;
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  // The wall-clock time without a zone: the run-document check then asks for an offset.
  if (value instanceof Date) return value.toISOString().slice(0, 19);
  if ('richText' in value) return value.richText.map((part) => part.text).join('');
  if ('formula' in value || 'sharedFormula' in value) return value.result === undefined ? '' : cellOf(value.result as ExcelJS.CellValue);
  if ('error' in value) return value.error;
  if ('text' in value) return value.text;
  return '';
}
