import { RollingSheet, type CellValue } from './rolling-sheet.js';
import { tabs, type SheetContext } from './pack-context.js';

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

export async function writeSummarySheet(ctx: SheetContext, csv: { name: string; sha256: string; rows: number }): Promise<void> {
  const sheet = new RollingSheet(ctx.workbook, 'Summary', [
    { header: 'Item', width: 28 },
    { header: 'Value', width: 70 },
  ], ctx.rowCap, { tab: tabs.summary, selected: true });
  const { totals, origin } = ctx;
  const rows: Array<[string, CellValue]> = [
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
  for (const row of rows) sheet.addRow(row);
  sheet.commit();
  await ctx.advance(0);
}
