import { z } from 'zod';

/**
 * How to read an uploaded file. `long`: one row per measurement. `wide`: one row per run with a
 * column per characteristic. The delimiter applies to CSV only; the decimal separator applies to
 * numbers written as text (every CSV value, and text cells of a workbook).
 */
export const uploadOptionsSchema = z.object({
  format: z.enum(['long', 'wide'], { error: "must be 'long' (one row per measurement) or 'wide' (one row per run)" }),
  delimiter: z.enum(['comma', 'semicolon', 'tab', ',', ';', '\t'], { error: "must be 'comma', 'semicolon' or 'tab'" }).default('comma')
    .transform((d) => ({ comma: ',', semicolon: ';', tab: '\t' } as Record<string, string>)[d] ?? d),
  decimal: z.enum(['.', ','], { error: "must be '.' or ','" }).default('.'),
  mode: z.literal('dry-run', { error: "must be 'dry-run'; a checked upload is committed with POST /api/v1/uploads/{id}/commit" }).default('dry-run'),
});
export type UploadOptions = Omit<z.infer<typeof uploadOptionsSchema>, 'mode'>;

const patterns = {
  '.': /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/,
  ',': /^[+-]?(\d+(,\d*)?|,\d+)([eE][+-]?\d+)?$/,
};

/**
 * A measured value from a cell. Text must be a plain decimal number with the chosen separator:
 * no thousands separators, no units, nothing to guess, so '12,3,4' or '1.234,5' is refused rather
 * than read as some other number.
 */
export function readNumber(cell: string | number, decimal: '.' | ','): { value: number } | { problem: string } {
  if (typeof cell === 'number') return Number.isFinite(cell) ? { value: cell } : { problem: `not a finite number '${cell}'` };
  const text = cell.trim();
  if (text === '') return { problem: 'is empty; a measurement needs a value' };
  if (!patterns[decimal].test(text)) {
    return { problem: `not a number '${cell}' (decimal separator '${decimal}', no thousands separators)` };
  }
  const value = Number(decimal === ',' ? text.replace(',', '.') : text);
  return Number.isFinite(value) ? { value } : { problem: `not a finite number '${cell}'` };
}
