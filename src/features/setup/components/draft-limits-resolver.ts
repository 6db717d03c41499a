import type { FieldErrors, Resolver } from 'react-hook-form';
import { draftLimitsSchema, type DraftLimitsInput } from '../../../../server/schemas/setup';

export type EditorRow = { characteristicCode: string; lsl: number | null; nominal: number | null; usl: number | null };
export type EditorValues = { rows: EditorRow[]; note: string };

const isBlank = (row: EditorRow) => row.lsl === null && row.nominal === null && row.usl === null;

/**
 * The editor shows every characteristic, but a blank row is "no limit", not a limit to send.
 * Blank rows are dropped, the server's own schema judges the rest, and each message is put back
 * on the editor row it came from.
 */
export const draftLimitsResolver: Resolver<EditorValues, unknown, DraftLimitsInput> = async (values) => {
  const kept = values.rows.map((row, index) => ({ row, index })).filter(({ row }) => !isBlank(row));
  const result = draftLimitsSchema.safeParse({ limits: kept.map(({ row }) => row), note: values.note || null });
  if (result.success) return { values: result.data, errors: {} };
  const rows: Array<Partial<Record<keyof EditorRow, { type: string; message: string }>>> = [];
  for (const issue of result.error.issues) {
    const [head, position, field] = issue.path;
    if (head !== 'limits' || typeof position !== 'number' || typeof field !== 'string') continue;
    const index = kept[position].index;
    rows[index] = { ...rows[index], [field]: { type: issue.code, message: issue.message } };
  }
  return { values: {}, errors: { rows } as FieldErrors<EditorValues> };
};
