import type { Knex } from 'knex';
import { packSerials } from '../pack-scope.js';
import { RollingSheet, formats } from './rolling-sheet.js';
import type { SheetContext } from './pack-context.js';

type MotorRow = {
  id: number; serial: string; product: string; lot: string; lot_id: number; status: string; attempts: number;
  last_station: string | null; last_tested_at: Date | null; created_at: Date;
};

const pageSize = 1000;

/** Motors or lots of this page that carry a hold not yet released. */
async function activeHolds(db: Knex, motorIds: number[], lotIds: number[]): Promise<{ motors: Set<number>; lots: Set<number> }> {
  const rows = (await db('holds').whereNull('released_at')
    .where((q) => q.whereIn('motor_id', motorIds).orWhereIn('lot_id', lotIds))
    .select('motor_id', 'lot_id')) as Array<{ motor_id: number | null; lot_id: number | null }>;
  return {
    motors: new Set(rows.filter((r) => r.motor_id !== null).map((r) => Number(r.motor_id))),
    lots: new Set(rows.filter((r) => r.lot_id !== null).map((r) => Number(r.lot_id))),
  };
}

/** One row per motor, in serial order, paged on the serial (unique). */
export async function writeMotorsSheet(ctx: SheetContext): Promise<void> {
  const sheet = new RollingSheet(ctx.workbook, 'Motors', [
    { header: 'Serial', width: 20 }, { header: 'Product', width: 12 }, { header: 'Lot', width: 16 },
    { header: 'Status', width: 12 }, { header: 'On hold', width: 9 }, { header: 'Attempts', numFmt: formats.integer },
    { header: 'Last station', width: 14 }, { header: 'Last tested (UTC)', width: 20, numFmt: formats.dateTime },
    { header: 'Created (UTC)', width: 20, numFmt: formats.dateTime },
  ], ctx.rowCap);
  const serials = await packSerials(ctx.db, ctx.filter);
  for (let start = 0; start < serials.length; start += pageSize) {
    const rows = (await ctx.db({ m: 'motors' }).join({ l: 'lots' }, 'l.id', 'm.lot_id').join({ p: 'products' }, 'p.id', 'm.product_id')
      .leftJoin({ s: 'stations' }, 's.id', 'm.last_station_id')
      .whereIn('m.serial', serials.slice(start, start + pageSize)).orderBy('m.serial')
      .select('m.id', 'm.serial', { product: 'p.code' }, { lot: 'l.code' }, 'm.lot_id', 'm.status', 'm.attempts',
        { last_station: 's.code' }, 'm.last_tested_at', 'm.created_at')) as MotorRow[];
    const holds = await activeHolds(ctx.db, rows.map((r) => Number(r.id)), [...new Set(rows.map((r) => Number(r.lot_id)))]);
    for (const r of rows) {
      const onHold = r.status === 'on hold' || holds.motors.has(Number(r.id)) || holds.lots.has(Number(r.lot_id));
      sheet.addRow([r.serial, r.product, r.lot, r.status, onHold ? 'yes' : 'no', Number(r.attempts), r.last_station,
        r.last_tested_at ? new Date(r.last_tested_at) : null, new Date(r.created_at)]);
    }
    await ctx.advance(rows.length);
  }
  sheet.commit();
}
