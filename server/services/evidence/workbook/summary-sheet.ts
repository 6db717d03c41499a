import type { PackWorkbook } from './pack-workbook.js';
import { SheetColumns, type CellValue } from './rolling-sheet.js';
import type { SheetContext } from './pack-context.js';

/** Plain-language lines for the filter, shared with the manifest's readers in mind. */
export function describeFilter(filter: SheetContext['filter']): Array<[string, string]> {
  const lines: Array<[string, string]> = [];
  if (filter.serials) lines.push(['Serials listed', `${filter.serials.length} (${filter.serials.slice(0, 5).join(', ')}${filter.serials.length > 5 ? ', …' : ''})`]);
  if (filter.serialFrom && filter.serialTo) lines.push(['Serial range', `${filter.serialFrom} to ${filter.serialTo}`]);
  if (filter.lots) lines.push(['Lots', filter.lots.join(', ')]);
  if (filter.product) lines.push(['Product', filter.product]);
  if (filter.from) lines.push(['Tested from (inclusive)', filter.from]);
  if (filter.to) lines.push(['Tested before (exclusive)', filter.to]);
  return lines;
}

type CsvFacts = { name: string; sha256: string; rows: number };

function summaryRows(ctx: SheetContext, csv: CsvFacts): Array<[string, CellValue]> {
  const { totals, origin } = ctx;
  return [
    ['Evidence pack', origin.packId],
    ['Made by', origin.requestedBy],
    ['Role', origin.requestedRole],
    ['Requested at (UTC)', origin.requestedAt.toISOString().replace('T', ' ').slice(0, 19)],
    ['Fluxtrail version', origin.version],
    ...describeFilter(ctx.filter),
    ['Motors', totals.motors],
    ['Motors passed', totals.motorStatus['passed'] ?? 0],
    ['Motors failed', totals.motorStatus['failed'] ?? 0],
    ['Motors on hold', totals.motorStatus['on hold'] ?? 0],
    ['Motors not tested', totals.motorStatus['not tested'] ?? 0],
    ['Test runs', totals.runs],
    ['Runs passed', totals.runVerdicts['pass'] ?? 0],
    ['Runs failed', totals.runVerdicts['fail'] ?? 0],
    ['Measurements', totals.measurements],
    ['Products', totals.products.map((p) => p.code).join(', ')],
    ['CSV file', csv.name],
    ['CSV rows (without header)', csv.rows],
    ['CSV SHA-256', csv.sha256],
    ['Times', 'All times are UTC.'],
  ];
}

/**
 * The Summary sheet is created before any other, so it is the first tab, but written after all of
 * them: it carries the CSV's hash, known only once the Results pass is done. Its two dozen rows
 * stay on one sheet whatever the row cap.
 */
export function openSummarySheet(workbook: PackWorkbook): (ctx: SheetContext, csv: CsvFacts) => Promise<void> {
  const columns = new SheetColumns([{ header: 'Item', width: 28 }, { header: 'Value', width: 70 }]);
  const shape = columns.shape('Summary');
  const { sheet, start } = workbook.addSheetWrittenLater(shape);
  columns.prepare(sheet);
  return async (ctx, csv) => {
    start();
    columns.writeHeader(sheet);
    for (const row of summaryRows(ctx, csv)) columns.writeRow(sheet, row, shape);
    sheet.commit();
    await ctx.advance(0);
  };
}
