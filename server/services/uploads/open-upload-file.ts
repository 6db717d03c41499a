import { readFile } from 'node:fs/promises';
import { badRequest, invalid } from '../../errors.js';
import { csvRecords, CsvSyntaxError, type SheetRow } from './csv-records.js';
import { xlsxRecords } from './xlsx-records.js';
import { readLayout, type Layout } from './upload-columns.js';
import type { UploadOptions } from './upload-options.js';

export type FileType = 'csv' | 'xlsx';
export type UploadFile = { path: string; fileType: FileType; options: UploadOptions };

/** An XLSX workbook is a ZIP archive; anything else is read as CSV text. */
export function sniffFileType(bytes: Buffer, fileName: string): FileType {
  if (bytes.subarray(0, 4).equals(Buffer.from([0x50, 0x4b, 0x03, 0x04]))) return 'xlsx';
  if (/\.xlsx?$/i.test(fileName)) throw badRequest(`${fileName} is not an XLSX workbook (an old .xls file must be saved as .xlsx or CSV first).`);
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw badRequest(`${fileName} is not UTF-8 text; save the CSV as UTF-8.`);
  }
  return 'csv';
}

/** The file's rows; a broken CSV structure or an unreadable workbook refuses the file as a whole. */
async function* rowsOf(file: UploadFile): AsyncGenerator<SheetRow> {
  try {
    if (file.fileType === 'xlsx') {
      yield* xlsxRecords(file.path);
    } else {
      yield* csvRecords(new TextDecoder('utf-8', { fatal: true }).decode(await readFile(file.path)), file.options.delimiter);
    }
  } catch (error) {
    if (error instanceof CsvSyntaxError) throw invalid([{ field: `row ${error.row}, column ${error.column}`, message: error.detail }], 'The file is not well-formed CSV.');
    throw badRequest(`The file cannot be read: ${error instanceof Error ? error.message : String(error)}`);
  }
}

/** A file's layout (from its first non-empty row) and its data rows after it, read as a stream. */
export async function openUpload(file: UploadFile): Promise<{ layout: Layout; rows: AsyncGenerator<SheetRow> }> {
  const rows = rowsOf(file);
  const first = await rows.next();
  if (first.done) throw invalid([{ field: 'file', message: 'the file holds no rows; the first row names the columns' }], 'The file is empty.');
  const read = readLayout(first.value.row, first.value.cells, file.options.format);
  if ('problems' in read) throw invalid(read.problems.map((p) => ({ field: `row ${p.row}, column ${p.column}`, message: p.message })), 'The header row cannot be read in this format.');
  return { layout: read.layout, rows };
}
