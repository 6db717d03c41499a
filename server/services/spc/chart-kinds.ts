import { allNelsonRules, allWesternElectricRules, type RuleName } from '../../analysis/spc/index.js';

/**
 * The charts a quality engineer can choose per characteristic. Every kind plots every test run
 * of the characteristic (first attempts and retests alike, in the order the runs were received):
 * a retest is the process measured again, and hiding it would hide a stand that needs retests.
 */
export const chartKinds = ['individuals', 'xbar-s-lot', 'xbar-s-consecutive', 'ewma', 'cusum'] as const;
export type ChartKind = (typeof chartKinds)[number];

/** Signals of the EWMA and CUSUM charts themselves; they have no run rules. */
export const chartRules = ['ewma-beyond', 'cusum-upper', 'cusum-lower'] as const;
export type ChartRule = (typeof chartRules)[number];
export type SignalRule = RuleName | ChartRule;

export const selectableRules: readonly RuleName[] = [...allNelsonRules, ...allWesternElectricRules];

/**
 * Defaults when the engineer picks no rules: Nelson 1, 2, 3 and 5 — a point beyond 3σ, a shift
 * (9 on one side), a trend (6 rising or falling) and 2 of 3 beyond 2σ. Rules 4, 6, 7 and 8 add
 * false alarms on stands whose resolution rounds values, so they are opt-in.
 */
export const defaultRules: readonly RuleName[] = ['nelson-1', 'nelson-2', 'nelson-3', 'nelson-5'];

export function rulesFor(kind: ChartKind, chosen: readonly RuleName[] | undefined): SignalRule[] {
  if (kind === 'ewma') return ['ewma-beyond'];
  if (kind === 'cusum') return ['cusum-upper', 'cusum-lower'];
  return [...(chosen && chosen.length > 0 ? chosen : defaultRules)];
}

export function isSubgroupKind(kind: ChartKind): boolean {
  return kind === 'xbar-s-lot' || kind === 'xbar-s-consecutive';
}

/** Phase I needs this many plotted points before limits mean anything (NIST/SEMATECH §6.3.1). */
export function minimumBaseline(kind: ChartKind): { count: number; unit: 'subgroups' | 'values' } {
  return isSubgroupKind(kind) ? { count: 25, unit: 'subgroups' } : { count: 100, unit: 'values' };
}

export type ChartParams = { lambda?: number; L?: number; k?: number; h?: number };

export const ewmaDefaults = { lambda: 0.2, L: 3 } as const;
export const cusumDefaults = { k: 0.5, h: 5 } as const;

/** The limits in force for Phase II, as spc_state keeps a copy of them. */
export type FrozenLimits = {
  limitId: number;
  kind: ChartKind;
  centre: number;
  sigma: number;
  subgroupSize: number | null;
  rules: SignalRule[];
  params: ChartParams;
};
