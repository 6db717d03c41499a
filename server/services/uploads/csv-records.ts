/** A cell as read from an uploaded file: CSV gives text; a workbook also gives numbers and booleans. */
export type Cell = string | number;
export type SheetRow = { row: number; cells: Cell[] };

/** A break in the file's CSV structure; nothing after it can be trusted, so the file is refused. */
export class CsvSyntaxError extends Error {
  constructor(readonly row: number, readonly column: number, readonly detail: string) {
    super(`row ${row}, column ${column}: ${detail}`);
  }
}

/**
 * Reads RFC 4180 records: fields separated by `delimiter`, optionally enclosed in double quotes,
 * a quote inside a quoted field written twice, records ended by CRLF or LF (a quoted field may
 * span lines). Row numbers count records, the header being row 1, as a spreadsheet would show the
 * file. Lines with no characters at all are skipped but still counted, so row numbers stay true.
 */
export function* csvRecords(text: string, delimiter: string): Generator<SheetRow> {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let row = 1;
  let position = 0;
  while (position < body.length) {
    const { cells, end } = readRecord(body, position, delimiter, row);
    const blank = cells.length === 1 && cells[0] === '' && end - position <= 2;
    if (!blank) yield { row, cells };
    row++;
    position = end;
  }
}

function readRecord(text: string, start: number, delimiter: string, row: number): { cells: string[]; end: number } {
  const cells: string[] = [];
  let position = start;
  for (;;) {
    const column = cells.length + 1;
    let value: string;
    if (text[position] === '"') {
      ({ value, position } = readQuoted(text, position + 1, row, column));
      const after = text[position];
      if (after !== undefined && after !== delimiter && after !== '\r' && after !== '\n') {
        throw new CsvSyntaxError(row, column, `unexpected character '${after}' after a closing quote; a quote inside a quoted field is written twice ("")`);
      }
    } else {
      let end = position;
      while (end < text.length && text[end] !== delimiter && text[end] !== '\r' && text[end] !== '\n') end++;
      value = text.slice(position, end);
      if (value.includes('"')) throw new CsvSyntaxError(row, column, 'a quote inside a field that does not start with a quote; enclose the whole field in quotes and double the inner one');
      position = end;
    }
    cells.push(value);
    const next = text[position];
    if (next === delimiter) { position++; continue; }
    if (next === '\r') position += text[position + 1] === '\n' ? 2 : 1;
    else if (next === '\n') position++;
    return { cells, end: position };
  }
}

function readQuoted(text: string, start: number, row: number, column: number): { value: string; position: number } {
  let value = '';
  let position = start;
  for (;;) {
    const close = text.indexOf('"', position);
    if (close < 0) throw new CsvSyntaxError(row, column, 'a quoted field is never closed');
    value += text.slice(position, close);
    if (text[close + 1] === '"') {
      value += '"';
      position = close + 2;
    } else {
      return { value, position: close + 1 };
    }
  }
}
