// Spreadsheet programs run a cell that starts with one of these as a formula. OWASP's
// CSV-injection guidance: prefix such text with a single quote so it is shown, never evaluated.
const formulaStarts = new Set(['=', '+', '-', '@', '\t', '\r']);

export const csvInjectionNote =
  'CSV text fields that start with =, +, -, @, a tab or a carriage return are prefixed with a single quote (\') ' +
  'so spreadsheet programs show them as text (OWASP CSV injection guidance). Numbers are written unchanged. ' +
  'The workbook stores all text as string cells, never as formulas, so it needs no prefix.';

export function neutraliseCsvText(text: string): string {
  return text.length > 0 && formulaStarts.has(text[0]) ? `'${text}` : text;
}

/** RFC 4180 quoting: only when the field holds a comma, a quote or a line break. */
export function csvField(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = neutraliseCsvText(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(values: ReadonlyArray<string | number | null>): string {
  return `${values.map(csvField).join(',')}\r\n`;
}
