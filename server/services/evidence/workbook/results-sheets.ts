import { eachRunPage, type PackRun } from '../read-pack-runs.js';
import type { PackCsv } from '../pack-csv.js';
import { RollingSheet, formats, type CellValue, type ColumnSpec } from './rolling-sheet.js';
import type { PassContext } from './pack-context.js';
import type { PackProduct } from '../pack-scope.js';

type Characteristic = { id: number; code: string; unit: string };

const runColumns: ColumnSpec[] = [
  { header: 'Serial', width: 20 }, { header: 'Run', width: 38 }, { header: 'Attempt', numFmt: formats.integer },
  { header: 'Started (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Station', width: 12 },
  { header: 'Calibration due', width: 16, numFmt: formats.date }, { header: 'Operator badge', width: 16 },
  { header: 'Program version', width: 16 }, { header: 'Limit revision', numFmt: formats.integer },
  { header: 'Verdict', width: 9 },
];

/** A run's row: its facts, then a value and verdict pair per characteristic of the product (empty when not measured). */
function resultsRow(run: PackRun, column: ReadonlyMap<number, number>, characteristicCount: number): CellValue[] {
  const row: CellValue[] = [run.serial, run.uuid, run.attempt, run.startedAt, run.station, run.calibrationDue,
    run.operatorBadge, run.programVersion, run.limitRevision, run.verdict];
  const first = row.length;
  row.length = first + characteristicCount * 2;
  row.fill(null, first);
  for (const m of run.measurements) {
    const index = column.get(m[1]);
    if (index === undefined) continue;
    row[first + index * 2] = m[2];
    row[first + index * 2 + 1] = m[5];
  }
  return row;
}

/**
 * One sheet per product (continued on numbered sheets when long): a row per run, a column pair
 * per characteristic. The same read of the runs writes the CSV, so the database is read once;
 * the CSV's lines therefore come product by product (in code order), each product's runs by id.
 */
export async function writeResultsSheets(ctx: PassContext, csv: PackCsv, products: readonly PackProduct[]): Promise<void> {
  for (const product of products) {
    const characteristics = (await ctx.db('characteristics').where({ product_id: product.id })
      .orderBy([{ column: 'sort_order' }, { column: 'id' }]).select('id', 'code', 'unit')) as Characteristic[];
    const column = new Map(characteristics.map((c, index) => [Number(c.id), index]));
    const sheet = new RollingSheet(ctx.workbook, `Results ${product.code}`, [
      ...runColumns,
      ...characteristics.flatMap((c): ColumnSpec[] => [
        { header: `${c.code} [${c.unit}]`, numFmt: formats.measured },
        { header: `${c.code} verdict` },
      ]),
    ], ctx.rowCap);
    await eachRunPage(ctx.db, ctx.filter, { productId: product.id }, async (runs) => {
      let measurements = 0;
      for (const run of runs) {
        sheet.addRow(resultsRow(run, column, characteristics.length));
        csv.addRun(run);
        measurements += run.measurements.length;
      }
      await Promise.all([sheet.settle(), csv.settle()]);
      await ctx.advance(runs.length + measurements);
    });
    sheet.commit();
  }
}
