import type { Knex } from 'knex';
import type { PackFilter } from '../pack-filter.js';
import type { PackTotals } from '../pack-scope.js';
import type { PackWorkbook } from './pack-workbook.js';

/** Who asked for the pack and when: printed on the Summary sheet and in the manifest. */
export type PackOrigin = { packId: number; requestedBy: string; requestedRole: string; requestedAt: Date; version: string };

/** Everything a sheet writer needs; `advance` reports rows written and throws when the job is cancelled. */
export type SheetContext = {
  db: Knex;
  workbook: PackWorkbook;
  filter: PackFilter;
  totals: PackTotals;
  origin: PackOrigin;
  rowCap: number;
  advance: (rows: number) => Promise<void>;
  /** The pack's serials in order, read once and shared by the sheets that page on them. */
  serials: () => Promise<string[]>;
};

/** What the Results pass needs: it starts before the pack's counts are in. */
export type PassContext = Omit<SheetContext, 'totals'>;

/** Excel refuses cells longer than this; longer text is cut with a visible marker. */
const cellTextMax = 32_767;

export function fitCell(text: string | null): string | null {
  if (text === null || text.length <= cellTextMax) return text;
  const marker = ' … (cut to fit a cell; the full text is in the audit trail)';
  return text.slice(0, cellTextMax - marker.length) + marker;
}
