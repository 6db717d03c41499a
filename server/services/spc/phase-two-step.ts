import { ruleViolationsAt, ruleWindowLength, type RuleName } from '../../analysis/spc/index.js';
import { cusumDefaults, ewmaDefaults, type FrozenLimits, type SignalRule } from './chart-kinds.js';

/** A plotted point in the trailing window, standardised to (x − centre)/σ of what is plotted. */
export type WindowPoint = { z: number; firstRunId: number; lotId: number };

/**
 * Everything Phase II needs to judge the next run without re-reading history: the last ≤ 15
 * plotted points (the longest run rule), the subgroup still filling, the EWMA and CUSUM sums,
 * and the rules broken at the last plotted point with the signal each episode opened.
 */
export type SpcStateData = {
  limits: FrozenLimits;
  window: WindowPoint[];
  open: { lotId: number; firstRunId: number; n: number; sum: number } | null;
  ewma: { z: number; t: number } | null;
  cusum: { high: number; low: number } | null;
  episodes: Partial<Record<SignalRule, number>>;
};

export type IncomingValue = { runId: number; lotId: number; value: number };
export type BrokenRule = { rule: SignalRule; patternFirstRunId: number };
/** A point that was plotted by this run, with the rules broken at it. */
export type JudgedPoint = { firstRunId: number; lotId: number; broken: BrokenRule[] };

export function freshState(limits: FrozenLimits): SpcStateData {
  return { limits, window: [], open: null, ewma: null, cusum: null, episodes: {} };
}

/** Judges one new value; returns the next state and the point it completed, if any. Pure. */
export function phaseTwoStep(state: SpcStateData, incoming: IncomingValue): { state: SpcStateData; judged: JudgedPoint | null } {
  const { limits } = state;
  switch (limits.kind) {
    case 'individuals':
      return plot(state, { z: (incoming.value - limits.centre) / limits.sigma, firstRunId: incoming.runId, lotId: incoming.lotId }, null);
    case 'xbar-s-consecutive': {
      const open = addToSubgroup(state.open, incoming);
      if (open.n < (limits.subgroupSize ?? 1)) return { state: { ...state, open }, judged: null };
      return plot(state, subgroupPoint(open, limits), null);
    }
    case 'xbar-s-lot': {
      // A lot's subgroup is complete when the first run of the next lot arrives (lots run in sequence).
      if (state.open === null || state.open.lotId === incoming.lotId) return { state: { ...state, open: addToSubgroup(state.open, incoming) }, judged: null };
      return plot(state, subgroupPoint(state.open, limits), addToSubgroup(null, incoming));
    }
    case 'ewma':
      return ewmaStep(state, incoming);
    case 'cusum':
      return cusumStep(state, incoming);
  }
}

function addToSubgroup(open: SpcStateData['open'], incoming: IncomingValue): NonNullable<SpcStateData['open']> {
  if (!open) return { lotId: incoming.lotId, firstRunId: incoming.runId, n: 1, sum: incoming.value };
  return { ...open, n: open.n + 1, sum: open.sum + incoming.value };
}

/** A subgroup mean judged against σ/√n, so lots of different sizes share one standard scale. */
function subgroupPoint(open: NonNullable<SpcStateData['open']>, limits: FrozenLimits): WindowPoint {
  const mean = open.sum / open.n;
  return { z: (mean - limits.centre) / (limits.sigma / Math.sqrt(open.n)), firstRunId: open.firstRunId, lotId: open.lotId };
}

function plot(state: SpcStateData, point: WindowPoint, open: SpcStateData['open']) {
  const window = [...state.window, point].slice(-ruleWindowLength);
  const rules = state.limits.rules.filter((rule): rule is RuleName => !rule.startsWith('ewma') && !rule.startsWith('cusum'));
  const broken = ruleViolationsAt(window.map((p) => p.z), { center: 0, sigma: 1 }, rules).map((violation) => ({
    rule: violation.rule,
    patternFirstRunId: window[Math.min(...violation.points)].firstRunId,
  }));
  return { state: { ...state, window, open }, judged: { firstRunId: point.firstRunId, lotId: point.lotId, broken } };
}

/** EWMA with time-varying limits counted from the freeze (NIST/SEMATECH §6.3.2.4). */
function ewmaStep(state: SpcStateData, incoming: IncomingValue) {
  const { centre, sigma, params } = state.limits;
  const lambda = params.lambda ?? ewmaDefaults.lambda;
  const L = params.L ?? ewmaDefaults.L;
  const previous = state.ewma ?? { z: centre, t: 0 };
  const t = previous.t + 1;
  const z = lambda * incoming.value + (1 - lambda) * previous.z;
  const halfWidth = L * sigma * Math.sqrt((lambda / (2 - lambda)) * (1 - (1 - lambda) ** (2 * t)));
  const broken: BrokenRule[] = Math.abs(z - centre) > halfWidth ? [{ rule: 'ewma-beyond', patternFirstRunId: incoming.runId }] : [];
  return { state: { ...state, ewma: { z, t } }, judged: { firstRunId: incoming.runId, lotId: incoming.lotId, broken } };
}

/** Tabular CUSUM, sums not reset after a signal (Montgomery & Runger, Example 16-6). */
function cusumStep(state: SpcStateData, incoming: IncomingValue) {
  const { centre, sigma, params } = state.limits;
  const K = (params.k ?? cusumDefaults.k) * sigma;
  const H = (params.h ?? cusumDefaults.h) * sigma;
  const previous = state.cusum ?? { high: 0, low: 0 };
  const high = Math.max(0, incoming.value - (centre + K) + previous.high);
  const low = Math.max(0, centre - K - incoming.value + previous.low);
  const broken: BrokenRule[] = [];
  if (high > H) broken.push({ rule: 'cusum-upper', patternFirstRunId: incoming.runId });
  if (low > H) broken.push({ rule: 'cusum-lower', patternFirstRunId: incoming.runId });
  return { state: { ...state, cusum: { high, low } }, judged: { firstRunId: incoming.runId, lotId: incoming.lotId, broken } };
}
