import type { Cell } from './csv-records.js';

/** A fault in the file named as a person would find it: sheet row and column header. */
export type Problem = { row: number; column: string; message: string };

/** Run-level columns, in both formats, named as the fields of the run document. */
export const runFields = ['serial', 'product', 'lot', 'station', 'startedAt', 'finishedAt', 'operatorBadge', 'programVersion'] as const;
export type RunField = (typeof runFields)[number];
const measurementFields = ['characteristic', 'value', 'unit'] as const;

/** A wide-format measurement column: `bemf.ke [V/krpm]` is characteristic bemf.ke in V/krpm. */
export type ResultColumn = { index: number; header: string; characteristic: string; unit: string };

export type Layout = {
  headerRow: number;
  headers: string[];
  run: Record<RunField, number>;
  /** Long format: where the characteristic, value and unit of each row are. */
  measurement?: Record<(typeof measurementFields)[number], number>;
  /** Wide format: one column per characteristic. */
  results?: ResultColumn[];
};

const resultHeader = /^(\S(?:.*\S)?)\s*\[\s*([^\]]*?)\s*\]$/;

/**
 * Reads the header row. Names are matched without regard to case or surrounding spaces. Every
 * column must be understood: an unknown column is refused rather than ignored, so no value in the
 * file is dropped without a word.
 */
export function readLayout(headerRow: number, cells: readonly Cell[], format: 'long' | 'wide'): { layout: Layout } | { problems: Problem[] } {
  const headers = cells.map((c) => String(c).trim());
  const problems: Problem[] = [];
  const known = new Map<string, number>();
  const results: ResultColumn[] = [];
  const names = new Map<string, string>([...runFields, ...(format === 'long' ? measurementFields : [])].map((f) => [f.toLowerCase(), f]));
  headers.forEach((header, index) => {
    const column = header || `column ${index + 1}`;
    const field = names.get(header.toLowerCase());
    const asResult = format === 'wide' ? resultHeader.exec(header) : null;
    if (header === '') problems.push({ row: headerRow, column, message: 'has no header; every column needs a name' });
    else if (field && known.has(field)) problems.push({ row: headerRow, column, message: `appears twice (first as column ${known.get(field)! + 1})` });
    else if (field) known.set(field, index);
    else if (asResult && asResult[2] === '') problems.push({ row: headerRow, column, message: 'names no unit between the brackets' });
    else if (asResult) results.push({ index, header, characteristic: asResult[1], unit: asResult[2] });
    else problems.push({ row: headerRow, column, message: format === 'wide' ? 'is not a run column; a characteristic column is written as its code with the unit in square brackets, e.g. bemf.ke [V/krpm]' : `is not a column of the long format (${[...runFields, ...measurementFields].join(', ')})` });
  });
  const required = format === 'long' ? [...runFields, ...measurementFields] : runFields;
  for (const field of required) {
    if (!known.has(field)) problems.push({ row: headerRow, column: field, message: 'is missing from the header row' });
  }
  const seen = new Map<string, string>();
  for (const r of results) {
    const earlier = seen.get(r.characteristic);
    if (earlier) problems.push({ row: headerRow, column: r.header, message: `repeats characteristic ${r.characteristic} of column '${earlier}'` });
    seen.set(r.characteristic, r.header);
  }
  if (format === 'wide' && results.length === 0) problems.push({ row: headerRow, column: '(header)', message: 'names no characteristic column, e.g. bemf.ke [V/krpm]' });
  if (problems.length > 0) return { problems };
  const at = (f: string) => known.get(f)!;
  const run = Object.fromEntries(runFields.map((f) => [f, at(f)])) as Record<RunField, number>;
  const layout: Layout = { headerRow, headers, run };
  if (format === 'long') layout.measurement = { characteristic: at('characteristic'), value: at('value'), unit: at('unit') };
  else layout.results = results;
  return { layout };
}

/** The header as written in the file, for messages. */
export const columnName = (layout: Layout, index: number) => layout.headers[index] || `column ${index + 1}`;
