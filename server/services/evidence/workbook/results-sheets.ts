import { eachRunPage } from '../read-pack-runs.js';
import { RollingSheet, formats, type CellValue, type ColumnSpec } from './rolling-sheet.js';
import type { SheetContext } from './pack-context.js';

type Characteristic = { id: number; code: string; unit: string };

const runColumns: ColumnSpec[] = [
  { header: 'Serial', width: 20 }, { header: 'Run', width: 38 }, { header: 'Attempt', numFmt: formats.integer },
  { header: 'Started (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Station', width: 12 },
  { header: 'Calibration due', width: 16, numFmt: formats.date }, { header: 'Operator badge', width: 16 },
  { header: 'Program version', width: 16 }, { header: 'Limit revision', numFmt: formats.integer },
  { header: 'Verdict', width: 9 },
];

/** One sheet per product (continued on numbered sheets when long): a row per run, a column pair per characteristic. */
export async function writeResultsSheets(ctx: SheetContext): Promise<void> {
  for (const product of ctx.totals.products) {
    const characteristics = (await ctx.db('characteristics').where({ product_id: product.id })
      .orderBy([{ column: 'sort_order' }, { column: 'id' }]).select('id', 'code', 'unit')) as Characteristic[];
    const sheet = new RollingSheet(ctx.workbook, `Results ${product.code}`, [
      ...runColumns,
      ...characteristics.flatMap((c): ColumnSpec[] => [
        { header: `${c.code} [${c.unit}]`, numFmt: formats.measured },
        { header: `${c.code} verdict` },
      ]),
    ], ctx.rowCap);
    await eachRunPage(ctx.db, ctx.filter, { productId: product.id }, async (runs) => {
      for (const run of runs) {
        const byCharacteristic = new Map(run.measurements.map((m) => [m.characteristicId, m]));
        const measured = characteristics.flatMap((c): CellValue[] => {
          const m = byCharacteristic.get(c.id);
          return m ? [m.value, m.verdict] : [null, null];
        });
        sheet.addRow([run.serial, run.uuid, run.attempt, run.startedAt, run.station, run.calibrationDue,
          run.operatorBadge, run.programVersion, run.limitRevision, run.verdict, ...measured]);
      }
      await ctx.advance(runs.length);
    });
    sheet.commit();
  }
}
