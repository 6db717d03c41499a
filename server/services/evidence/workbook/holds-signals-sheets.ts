import { packMotors } from '../pack-scope.js';
import { RollingSheet, formats, type CellValue } from './rolling-sheet.js';
import { fitCell, type SheetContext } from './pack-context.js';

type HoldRow = {
  id: number; serial: string | null; lot: string | null; kind: string; reason: string; placed_by: string;
  placed_at: Date; released_by: string | null; released_at: Date | null; release_reason: string | null;
};

/** Holds on the pack's motors or on their lots, released or not. */
export async function writeHoldsSheet(ctx: SheetContext): Promise<void> {
  const motorIds = packMotors(ctx.db, ctx.filter).select('m.id');
  const lotIds = packMotors(ctx.db, ctx.filter).distinct('m.lot_id');
  const rows = (await ctx.db({ h: 'holds' })
    .leftJoin({ hm: 'motors' }, 'hm.id', 'h.motor_id')
    .leftJoin({ hl: 'lots' }, 'hl.id', 'h.lot_id')
    .where((q) => q.whereIn('h.motor_id', motorIds).orWhereIn('h.lot_id', lotIds))
    .orderBy('h.id')
    .select('h.id', { serial: 'hm.serial' }, { lot: 'hl.code' }, 'h.kind', 'h.reason', 'h.placed_by', 'h.placed_at',
      'h.released_by', 'h.released_at', 'h.release_reason')) as HoldRow[];
  const sheet = new RollingSheet(ctx.workbook, 'Holds', [
    { header: 'Hold', numFmt: formats.integer }, { header: 'On', width: 8 }, { header: 'Serial or lot', width: 20 },
    { header: 'Kind' }, { header: 'Reason', width: 40 }, { header: 'Placed by', width: 20 },
    { header: 'Placed at (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Released by', width: 20 },
    { header: 'Released at (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Release reason', width: 40 },
  ], ctx.rowCap);
  for (const r of rows) {
    sheet.addRow([Number(r.id), r.serial ? 'motor' : 'lot', r.serial ?? r.lot, r.kind, r.reason, r.placed_by,
      new Date(r.placed_at), r.released_by, r.released_at ? new Date(r.released_at) : null, r.release_reason]);
  }
  sheet.commit();
  await ctx.advance(0);
}

function asCell(value: unknown): CellValue {
  if (value === null || value === undefined) return null;
  if (value instanceof Date || typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean') {
    return typeof value === 'string' ? fitCell(value) : value;
  }
  return fitCell(JSON.stringify(value));
}

/**
 * SPC signals on the pack's lots. The signals table belongs to the SPC area and may not exist
 * (or may grow columns), so the sheet is written only when it exists, with whatever columns it has.
 */
export async function writeSignalsSheet(ctx: SheetContext): Promise<void> {
  if (!(await ctx.db.schema.hasTable('signals'))) return;
  const columns = Object.keys(await ctx.db('signals').columnInfo());
  if (!columns.includes('lot_id')) return;
  const lotIds = packMotors(ctx.db, ctx.filter).distinct('m.lot_id');
  const rows = (await ctx.db('signals').whereIn('lot_id', lotIds).orderBy('id').select(columns)) as Array<Record<string, unknown>>;
  const sheet = new RollingSheet(ctx.workbook, 'Signals', columns.map((name) => ({
    header: name, numFmt: /_at$/.test(name) ? formats.dateTime : undefined, width: /_at$/.test(name) ? 20 : undefined,
  })), ctx.rowCap);
  for (const row of rows) sheet.addRow(columns.map((name) => asCell(row[name])));
  sheet.commit();
  await ctx.advance(0);
}
