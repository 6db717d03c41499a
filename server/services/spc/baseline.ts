import type { Knex } from 'knex';
import { individualsChart, xbarSChart } from '../../analysis/spc/index.js';
import { invalid } from '../../errors.js';
import { cusumDefaults, ewmaDefaults, isSubgroupKind, minimumBaseline, type ChartKind, type ChartParams } from './chart-kinds.js';
import { groupByLot, groupConsecutive, readValues, readValuesWithLots, type RunRange } from './series.js';

export type Exclusions = { runIds: Set<number>; lotIds: Set<number> };
export type CalculatedLimits = { centre: number; ucl: number; lcl: number; sigma: number; params: ChartParams; points: number; fromRunId: number; toRunId: number };

/** The Phase I groups of a window: one per value, per n consecutive runs, or per lot. */
async function baselineGroups(db: Knex, characteristicId: number, kind: ChartKind, subgroupSize: number | null, range: RunRange, excluded: Exclusions) {
  if (kind === 'xbar-s-lot') {
    const lots = groupByLot(await readValuesWithLots(db, characteristicId, range));
    // A lot of one motor has no standard deviation, so it cannot be a subgroup of an X̄-S chart.
    return lots.filter((lot) => lot.values.length >= 2)
      .map((lot) => ({ firstRunId: lot.firstRunId, lastRunId: lot.lastRunId, values: lot.values, excluded: excluded.lotIds.has(lot.lotId) }));
  }
  const values = await readValues(db, characteristicId, range);
  if (kind === 'xbar-s-consecutive') {
    return groupConsecutive(values, subgroupSize ?? 5)
      .map((g) => ({ firstRunId: g.firstRunId, lastRunId: g.runIds[g.runIds.length - 1], values: g.values, excluded: g.runIds.some((id) => excluded.runIds.has(id)) }));
  }
  return values.map((v) => ({ firstRunId: v.runId, lastRunId: v.runId, values: [v.value], excluded: excluded.runIds.has(v.runId) }));
}

/**
 * Trial limits from a baseline window, leaving out the points with an assignable cause. The
 * window must hold at least 25 subgroups or 100 values (counted before exclusions); fewer is a
 * 422 naming `from`, the bound to move.
 */
export async function calculateLimits(
  db: Knex, characteristicId: number, kind: ChartKind, subgroupSize: number | null, params: ChartParams, range: RunRange, excluded: Exclusions,
): Promise<CalculatedLimits> {
  const groups = await baselineGroups(db, characteristicId, kind, subgroupSize, range, excluded);
  const needed = minimumBaseline(kind);
  if (groups.length < needed.count) {
    throw invalid([{ field: 'from', message: `the window holds ${groups.length} ${needed.unit}; trial limits need at least ${needed.count}` }],
      `Not enough data for trial limits: ${groups.length} of ${needed.count} ${needed.unit}.`);
  }
  const kept = groups.filter((g) => !g.excluded);
  const window = { points: kept.length, fromRunId: groups[0].firstRunId, toRunId: groups.reduce((last, g) => Math.max(last, g.lastRunId), 0) }; // no spread: a baseline can hold 100k+ runs
  if (isSubgroupKind(kind)) {
    if (kept.length < 2) throw invalid([{ field: 'exclusions', message: 'too many subgroups are excluded' }]);
    const chart = xbarSChart(kept.map((g) => g.values));
    return { ...window, centre: chart.xbar.center, ucl: chart.xbar.ucl, lcl: chart.xbar.lcl, sigma: chart.sigma, params: { } };
  }
  const values = kept.map((g) => g.values[0]);
  if (values.length < 2) throw invalid([{ field: 'exclusions', message: 'too many values are excluded' }]);
  const chart = individualsChart(values);
  if (kind === 'ewma') {
    const p = { lambda: params.lambda ?? ewmaDefaults.lambda, L: params.L ?? ewmaDefaults.L };
    const half = p.L * chart.sigma * Math.sqrt(p.lambda / (2 - p.lambda));
    return { ...window, centre: chart.center, ucl: chart.center + half, lcl: chart.center - half, sigma: chart.sigma, params: p };
  }
  if (kind === 'cusum') {
    // The CUSUM chart plots the two sums against the decision interval H = hσ.
    const p = { k: params.k ?? cusumDefaults.k, h: params.h ?? cusumDefaults.h };
    return { ...window, centre: chart.center, ucl: p.h * chart.sigma, lcl: -p.h * chart.sigma, sigma: chart.sigma, params: p };
  }
  return { ...window, centre: chart.center, ucl: chart.ucl, lcl: chart.lcl, sigma: chart.sigma, params: {} };
}
