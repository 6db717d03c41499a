import type { Knex } from 'knex';
import { packMotors } from '../pack-scope.js';
import { eachPageReadAhead } from '../read-ahead.js';
import { RollingSheet, formats } from './rolling-sheet.js';
import type { PassContext } from './pack-context.js';

type MotorRow = {
  id: number; serial: string; product: string; lot: string; lot_id: number; status: string; attempts: number;
  last_station: string | null; last_tested_at: Date | null; created_at: Date;
};

// Below MariaDB's in_predicate_conversion_threshold (1000): a longer IN list becomes a derived
// table, and the plan walks the whole table instead of looking each serial up.
const pageSize = 500;

/** The pack's motors and lots that carry a hold not yet released (few: read once). */
async function activeHolds(ctx: PassContext): Promise<{ motors: Set<number>; lots: Set<number> }> {
  const rows = (await ctx.db('holds').whereNull('released_at')
    .where((q) => q.whereIn('motor_id', packMotors(ctx.db, ctx.filter).select('m.id'))
      .orWhereIn('lot_id', packMotors(ctx.db, ctx.filter).distinct('m.lot_id')))
    .select('motor_id', 'lot_id')) as Array<{ motor_id: number | null; lot_id: number | null }>;
  return {
    motors: new Set(rows.filter((r) => r.motor_id !== null).map((r) => Number(r.motor_id))),
    lots: new Set(rows.filter((r) => r.lot_id !== null).map((r) => Number(r.lot_id))),
  };
}

function readMotors(db: Knex, serials: string[]): Promise<MotorRow[]> {
  return db({ m: 'motors' }).join({ l: 'lots' }, 'l.id', 'm.lot_id').join({ p: 'products' }, 'p.id', 'm.product_id')
    .leftJoin({ s: 'stations' }, 's.id', 'm.last_station_id')
    .whereIn('m.serial', serials).orderBy('m.serial')
    .select('m.id', 'm.serial', { product: 'p.code' }, { lot: 'l.code' }, 'm.lot_id', 'm.status', 'm.attempts',
      { last_station: 's.code' }, 'm.last_tested_at', 'm.created_at')
    .then((rows: MotorRow[]) => rows);
}

/** One row per motor, in serial order, paged on the serial (unique); the next page is read while this one is written. */
export async function writeMotorsSheet(ctx: PassContext): Promise<void> {
  const serials = await ctx.serials();
  const holds = await activeHolds(ctx);
  const sheet = new RollingSheet(ctx.workbook, 'Motors', [
    { header: 'Serial', width: 20 }, { header: 'Product', width: 12 }, { header: 'Lot', width: 16 },
    { header: 'Status', width: 12 }, { header: 'On hold', width: 9 }, { header: 'Attempts', numFmt: formats.integer },
    { header: 'Last station', width: 14 }, { header: 'Last tested (UTC)', width: 20, numFmt: formats.dateTime },
    { header: 'Created (UTC)', width: 20, numFmt: formats.dateTime },
  ], ctx.rowCap);
  await eachPageReadAhead(Math.ceil(serials.length / pageSize), (page) => readMotors(ctx.db, serials.slice(page * pageSize, (page + 1) * pageSize)), async (rows) => {
    for (const r of rows) {
      const onHold = r.status === 'on hold' || holds.motors.has(Number(r.id)) || holds.lots.has(Number(r.lot_id));
      sheet.addRow([r.serial, r.product, r.lot, r.status, onHold ? 'yes' : 'no', Number(r.attempts), r.last_station,
        r.last_tested_at ? new Date(r.last_tested_at) : null, new Date(r.created_at)]);
    }
    await sheet.settle();
    await ctx.advance(rows.length);
  });
  sheet.commit();
}
