import type { Knex } from 'knex';
import { ewmaChart, ruleViolations, type RuleName } from '../../analysis/spc/index.js';
import { ewmaDefaults } from './chart-kinds.js';
import { notFound } from '../../errors.js';
import { currentLimitsOf, type ControlLimitView } from './control-limit-rows.js';
import { describeSignalRule, isSignalRule } from './describe-signal-rule.js';
import { displaySeries } from './display-series.js';
import { runRangeOf, type RunRange, type SeriesValue } from './series.js';
import { characteristicFacts, specLimitsOf } from './spec-limits.js';

/**
 * Rule marks on the exact points sent (all values, or the recent tail of a long series) against
 * the limits in force or the trial ones. On a tail a pattern that began before it is judged from
 * the tail's first point; the signals list below holds what Phase II found on every value.
 */
function marks(values: readonly SeriesValue[], limits: ControlLimitView | null) {
  if (!limits || limits.chartKind !== 'individuals' || values.length === 0) return [];
  const rules = limits.rules as RuleName[];
  return ruleViolations(values.map((v) => v.value), { center: limits.centre, sigma: limits.sigma }, rules)
    .map((v) => ({ runId: values[v.index].runId, value: values[v.index].value, rule: v.rule, ruleText: describeSignalRule(v.rule) }));
}

/**
 * The EWMA statistic over the exact points sent, for an EWMA chart: its limits apply to z, not to
 * the raw values. For display only, z starts at the centre with the first point sent; Phase II
 * judges every value with z carried since the freeze (phase-two-step.ts).
 */
function ewmaDisplay(values: readonly SeriesValue[], limits: ControlLimitView | null) {
  if (!limits || limits.chartKind !== 'ewma' || values.length === 0) return [];
  const lambda = limits.params.lambda ?? ewmaDefaults.lambda;
  const L = limits.params.L ?? ewmaDefaults.L;
  const chart = ewmaChart(values.map((v) => v.value), { lambda, L, target: limits.centre, sigma: limits.sigma });
  return chart.points.map((p, i) => ({ runId: values[i].runId, z: p.z }));
}

type SignalRow = { id: number; rule: string; first_run_id: number | string; status: string; value: number | null };

/** The newest signals started in the window, each with the value of the point that started it. */
async function signalsIn(db: Knex, characteristicId: number, range: RunRange) {
  const rows: SignalRow[] = await db('signals as s')
    .leftJoin('measurements as m', (on) => on.on('m.run_id', 's.first_run_id').andOn('m.characteristic_id', 's.characteristic_id'))
    .where('s.characteristic_id', characteristicId).whereBetween('s.first_run_id', [range.fromRunId, range.toRunId])
    .orderBy('s.id', 'desc').limit(200).select('s.id', 's.rule', 's.first_run_id', 's.status', 'm.value');
  return rows.map((s) => ({ id: s.id, rule: s.rule, runId: Number(s.first_run_id), status: s.status, value: s.value, ruleText: isSignalRule(s.rule) ? describeSignalRule(s.rule) : s.rule }));
}

/**
 * One characteristic's chart for a time window: display series (exact, or summary buckets with
 * the recent values exact), limits, spec lines, rule marks and signals. No statistic over all
 * values is computed here; capability has its own request.
 */
export async function chartView(db: Knex, characteristicId: number, window: { from?: Date; to?: Date }) {
  const facts = await characteristicFacts(db, characteristicId);
  if (!facts) throw notFound(`No characteristic ${characteristicId}.`);
  const range = await runRangeOf(db, window);
  const [series, limits, spec, signals] = await Promise.all([
    displaySeries(db, characteristicId, range), currentLimitsOf(db, characteristicId), specLimitsOf(db, characteristicId), signalsIn(db, characteristicId, range),
  ]);
  return {
    characteristic: { id: facts.id, code: facts.code, name: facts.name, unit: facts.unit, product: facts.product_code, spcEnabled: Boolean(facts.spc_enabled) },
    limits,
    spec,
    ...series,
    violations: marks(series.points, limits.frozen ?? limits.trial),
    ewma: ewmaDisplay(series.points, limits.frozen ?? limits.trial),
    signals,
  };
}
