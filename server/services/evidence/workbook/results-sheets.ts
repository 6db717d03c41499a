import type { Knex } from 'knex';
import type { ResultsPage } from '../results-page.js';
import { RollingSheet, formats, type CellValue, type ColumnSpec } from './rolling-sheet.js';
import type { PassContext } from './pack-context.js';
import type { PackProduct } from '../pack-scope.js';

type Characteristic = { id: number; code: string; unit: string };

/** A product and its characteristics in test-plan order: one Results column pair each. */
export type ProductPlan = { product: PackProduct; characteristics: Characteristic[] };

export async function productPlans(db: Knex, products: readonly PackProduct[]): Promise<ProductPlan[]> {
  return Promise.all(products.map(async (product) => {
    const rows = (await db('characteristics').where({ product_id: product.id })
      .orderBy([{ column: 'sort_order' }, { column: 'id' }]).select('id', 'code', 'unit')) as Characteristic[];
    return { product, characteristics: rows.map((c) => ({ id: Number(c.id), code: c.code, unit: c.unit })) };
  }));
}

const runColumns: ColumnSpec[] = [
  { header: 'Serial', width: 20 }, { header: 'Run', width: 38 }, { header: 'Attempt', numFmt: formats.integer },
  { header: 'Started (UTC)', width: 20, numFmt: formats.dateTime }, { header: 'Station', width: 12 },
  { header: 'Calibration due', width: 16, numFmt: formats.date }, { header: 'Operator badge', width: 16 },
  { header: 'Program version', width: 16 }, { header: 'Limit revision', numFmt: formats.integer },
  { header: 'Verdict', width: 9 },
];

/** Each run's row: its facts, then a value and verdict pair per characteristic of the product (empty when not measured). */
function writePage(sheet: RollingSheet, page: ResultsPage, width: number): void {
  page.runs.forEach((run, r) => {
    const row: CellValue[] = [run.serial, run.uuid, run.attempt, run.startedAt, run.station, run.calibrationDue,
      run.operatorBadge, run.programVersion, run.limitRevision, run.verdict];
    for (let c = r * width, end = c + width; c < end; c++) {
      const code = page.verdicts[c];
      if (code === 0) row.push(null, null);
      else row.push(page.values[c], page.verdictNames[code]);
    }
    sheet.addRow(row);
  });
}

/**
 * One sheet per product (continued on numbered sheets when long): a row per run, a column pair
 * per characteristic. The pages come from the read that also writes the CSV (PackZipThread), so
 * the database is read once; the CSV's lines therefore come product by product (in code order),
 * each product's runs by id.
 */
export async function writeResultsSheets(ctx: PassContext, plans: readonly ProductPlan[], pages: () => AsyncIterable<ResultsPage>): Promise<void> {
  for (const { product, characteristics } of plans) {
    const sheet = new RollingSheet(ctx.workbook, `Results ${product.code}`, [
      ...runColumns,
      ...characteristics.flatMap((c): ColumnSpec[] => [
        { header: `${c.code} [${c.unit}]`, numFmt: formats.measured },
        { header: `${c.code} verdict` },
      ]),
    ], ctx.rowCap);
    for await (const page of pages()) {
      writePage(sheet, page, characteristics.length);
      await sheet.settle();
      await ctx.advance(page.runs.length + page.measurements);
    }
    sheet.commit();
  }
}
