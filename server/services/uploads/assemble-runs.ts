import type { Cell, SheetRow } from './csv-records.js';
import { columnName, runFields, type Layout, type Problem, type RunField } from './upload-columns.js';
import { readNumber, type UploadOptions } from './upload-options.js';
import { uploadRunId } from './run-key.js';

/** Where one result of a run came from, so a fault found later is named by row and column. */
type ResultOrigin = { row: number; columns: { characteristic: string; value: string; unit: string } };

/** The rows of one run, read into a run document (not yet checked) and the faults found so far. */
export type CandidateRun = {
  runId: string; firstRow: number; lastRow: number; rowCount: number; fields: Record<RunField, string>;
  results: Array<{ characteristic: string; value: number; unit: string }>;
  origins: ResultOrigin[]; problems: Problem[]; layout: Layout;
};

const timeFields = new Set<RunField>(['startedAt', 'finishedAt']);

function text(cell: Cell | undefined, field: string, row: number, column: string, problems: Problem[]): string {
  if (cell === undefined) return '';
  if (typeof cell === 'number' && timeFields.has(field as RunField)) {
    problems.push({ row, column, message: `is the number ${cell} (a spreadsheet date?); write it as ISO 8601 text with an offset, e.g. 2026-12-01T08:15:00+01:00` });
    return '';
  }
  return String(cell).trim();
}

function readRow(layout: Layout, sheetRow: SheetRow, problems: Problem[]): Record<RunField, string> {
  const { row, cells } = sheetRow;
  cells.forEach((cell, index) => {
    if (index >= layout.headers.length && cell !== '') problems.push({ row, column: `column ${index + 1}`, message: `holds '${cell}' beyond the last header column` });
  });
  return Object.fromEntries(runFields.map((f) => [f, text(cells[layout.run[f]], f, row, columnName(layout, layout.run[f]), problems)])) as Record<RunField, string>;
}

function newRun(layout: Layout, row: number, fields: Record<RunField, string>, problems: Problem[]): CandidateRun {
  return { runId: uploadRunId(fields.serial, fields.startedAt, fields.station), firstRow: row, lastRow: row, rowCount: 1, fields, results: [], origins: [], problems, layout };
}

/** Wide format: each row is one run; an empty characteristic cell means it was not measured. */
export async function* wideRuns(rows: AsyncIterable<SheetRow>, layout: Layout, options: UploadOptions): AsyncGenerator<CandidateRun> {
  for await (const sheetRow of rows) {
    const problems: Problem[] = [];
    const run = newRun(layout, sheetRow.row, readRow(layout, sheetRow, problems), problems);
    for (const column of layout.results ?? []) {
      const cell = sheetRow.cells[column.index];
      if (cell === undefined || cell === '') continue;
      const number = readNumber(cell, options.decimal);
      if ('problem' in number) problems.push({ row: sheetRow.row, column: column.header, message: number.problem });
      else {
        run.results.push({ characteristic: column.characteristic, value: number.value, unit: column.unit });
        run.origins.push({ row: sheetRow.row, columns: { characteristic: column.header, value: column.header, unit: column.header } });
      }
    }
    yield run;
  }
}

/**
 * Long format: one row per measurement; consecutive rows with the same serial, startedAt and
 * station form one run, and their other run columns must agree. Rows of a run must stand together,
 * which lets a file of millions of rows be read as a stream.
 */
export async function* longRuns(rows: AsyncIterable<SheetRow>, layout: Layout, options: UploadOptions): AsyncGenerator<CandidateRun> {
  const m = layout.measurement!;
  let current: CandidateRun | undefined;
  for await (const sheetRow of rows) {
    const { row, cells } = sheetRow;
    const problems: Problem[] = [];
    const fields = readRow(layout, sheetRow, problems);
    const sameRun = current && (['serial', 'startedAt', 'station'] as const).every((f) => current!.fields[f] === fields[f]);
    if (!sameRun) {
      if (current) yield current;
      current = newRun(layout, row, fields, []);
    }
    const run = current!;
    if (sameRun) run.rowCount++;
    run.lastRow = row;
    run.problems.push(...problems);
    for (const f of runFields) {
      if (run.fields[f] !== fields[f]) run.problems.push({ row, column: columnName(layout, layout.run[f]), message: `'${fields[f]}' differs from '${run.fields[f]}' in row ${run.firstRow} of the same run` });
    }
    const number = readNumber(cells[m.value] ?? '', options.decimal);
    if ('problem' in number) run.problems.push({ row, column: columnName(layout, m.value), message: number.problem });
    else {
      run.results.push({ characteristic: String(cells[m.characteristic] ?? '').trim(), value: number.value, unit: String(cells[m.unit] ?? '').trim() });
      run.origins.push({ row, columns: { characteristic: columnName(layout, m.characteristic), value: columnName(layout, m.value), unit: columnName(layout, m.unit) } });
    }
  }
  if (current) yield current;
}

export function runsOf(rows: AsyncIterable<SheetRow>, layout: Layout, options: UploadOptions): AsyncGenerator<CandidateRun> {
  return layout.results ? wideRuns(rows, layout, options) : longRuns(rows, layout, options);
}
