import { RollingSheet, formats } from './rolling-sheet.js';
import type { SheetContext } from './pack-context.js';

type LimitRow = {
  product: string; revision: number; status: string; effective_from: Date | null; authored_by_name: string;
  authored_at: Date; approved_by_name: string | null; approved_at: Date | null; characteristic: string;
  unit: string; lsl: number | null; nominal: number | null; usl: number | null;
};

const date = (value: Date | null) => (value ? new Date(value) : null);

/** Every limit revision that judged a run in the pack, one row per limit, with author and approver. */
export async function writeLimitsSheet(ctx: SheetContext): Promise<void> {
  const rows = (await ctx.db({ ls: 'limit_sets' })
    .join({ p: 'products' }, 'p.id', 'ls.product_id')
    .join({ li: 'limits' }, 'li.limit_set_id', 'ls.id')
    .join({ c: 'characteristics' }, 'c.id', 'li.characteristic_id')
    .whereIn('ls.id', ctx.totals.limitSetIds)
    .orderBy([{ column: 'p.code' }, { column: 'ls.revision' }, { column: 'c.sort_order' }, { column: 'c.id' }])
    .select({ product: 'p.code' }, 'ls.revision', 'ls.status', 'ls.effective_from', 'ls.authored_by_name', 'ls.authored_at',
      'ls.approved_by_name', 'ls.approved_at', { characteristic: 'c.code' }, 'c.unit', 'li.lsl', 'li.nominal', 'li.usl')) as LimitRow[];
  const sheet = new RollingSheet(ctx.workbook, 'Limits', [
    { header: 'Product', width: 12 }, { header: 'Revision', numFmt: formats.integer }, { header: 'Status' },
    { header: 'Effective from (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Authored by', width: 20 },
    { header: 'Authored at (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Approved by', width: 20 },
    { header: 'Approved at (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Characteristic', width: 22 },
    { header: 'Unit' }, { header: 'LSL', numFmt: formats.measured }, { header: 'Nominal', numFmt: formats.measured },
    { header: 'USL', numFmt: formats.measured },
  ], ctx.rowCap);
  for (const r of rows) {
    sheet.addRow([r.product, Number(r.revision), r.status, date(r.effective_from), r.authored_by_name, date(r.authored_at),
      r.approved_by_name, date(r.approved_at), r.characteristic, r.unit, r.lsl, r.nominal, r.usl]);
  }
  sheet.commit();
  await ctx.advance(0);
}

type StationRow = {
  code: string; line: string; kind: string; name: string; calibration_due: Date;
  calibrated_on: Date | null; due: Date | null; certificate: string | null; recorded_by: string | null; recorded_at: Date | null;
};

/** The stations that tested the pack's motors, one row per calibration record (or one bare row). */
export async function writeStationsSheet(ctx: SheetContext): Promise<void> {
  const rows = (await ctx.db({ s: 'stations' })
    .leftJoin({ sc: 'station_calibrations' }, 'sc.station_id', 's.id')
    .whereIn('s.id', ctx.totals.stationIds)
    .orderBy([{ column: 's.code' }, { column: 'sc.calibrated_on' }, { column: 'sc.id' }])
    .select('s.code', 's.line', 's.kind', 's.name', 's.calibration_due', 'sc.calibrated_on', 'sc.due', 'sc.certificate',
      'sc.recorded_by', 'sc.recorded_at')) as StationRow[];
  const sheet = new RollingSheet(ctx.workbook, 'Stations', [
    { header: 'Station', width: 12 }, { header: 'Line' }, { header: 'Kind', width: 14 }, { header: 'Name', width: 24 },
    { header: 'Calibration due now', width: 18, numFmt: formats.date }, { header: 'Calibrated on', width: 14, numFmt: formats.date },
    { header: 'Due after that', width: 14, numFmt: formats.date }, { header: 'Certificate', width: 18 },
    { header: 'Recorded by', width: 20 }, { header: 'Recorded at (UTC)', width: 20, numFmt: formats.dateTime },
  ], ctx.rowCap);
  for (const r of rows) {
    sheet.addRow([r.code, r.line, r.kind, r.name, new Date(r.calibration_due), date(r.calibrated_on), date(r.due),
      r.certificate, r.recorded_by, date(r.recorded_at)]);
  }
  sheet.commit();
  await ctx.advance(0);
}
