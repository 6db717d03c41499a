import type { Knex } from 'knex';
import { ruleViolations, type RuleName } from '../../analysis/spc/index.js';
import { notFound } from '../../errors.js';
import { currentLimitsOf, type ControlLimitView } from './control-limit-rows.js';
import { describeSignalRule } from './describe-signal-rule.js';
import { readValues, runRangeOf, type RunRange } from './series.js';
import { characteristicFacts, specLimitsOf } from './spec-limits.js';

/** The display never gets more than this many points; statistics are computed elsewhere on all data. */
export const maxDisplayPoints = 2000;

type Bucket = { fromRunId: number; toRunId: number; min: number; max: number; mean: number; n: number };

/**
 * Long series are cut into maxDisplayPoints/2 run-id buckets and each sends its min and max (so a
 * spike is never averaged away), aggregated by MariaDB over the covering index.
 */
async function bucketsOf(db: Knex, characteristicId: number, range: RunRange, first: number, last: number): Promise<Bucket[]> {
  const count = maxDisplayPoints / 2;
  const span = last - first + 1;
  const [rows] = await db.raw(
    `SELECT FLOOR((run_id - ?) * ? / ?) AS b, MIN(run_id) AS from_run, MAX(run_id) AS to_run, MIN(value) AS min_v, MAX(value) AS max_v, AVG(value) AS mean_v, COUNT(*) AS n
       FROM measurements FORCE INDEX (measurements_series)
      WHERE characteristic_id = ? AND run_id BETWEEN ? AND ?
      GROUP BY b ORDER BY b`,
    [first, count, span, characteristicId, range.fromRunId, range.toRunId],
  ) as [Array<{ from_run: number; to_run: number; min_v: number; max_v: number; mean_v: number; n: number }>];
  return rows.map((r) => ({ fromRunId: Number(r.from_run), toRunId: Number(r.to_run), min: r.min_v, max: r.max_v, mean: Number(r.mean_v), n: Number(r.n) }));
}

/** Rule marks on an exact individuals series against the limits in force (or the trial ones). */
function marks(values: Array<{ runId: number; value: number }>, limits: ControlLimitView | null) {
  if (!limits || limits.chartKind !== 'individuals' || values.length === 0) return [];
  const rules = limits.rules as RuleName[];
  return ruleViolations(values.map((v) => v.value), { center: limits.centre, sigma: limits.sigma }, rules)
    .map((v) => ({ runId: values[v.index].runId, value: values[v.index].value, rule: v.rule, ruleText: describeSignalRule(v.rule) }));
}

export async function chartView(db: Knex, characteristicId: number, window: { from?: Date; to?: Date }) {
  const facts = await characteristicFacts(db, characteristicId);
  if (!facts) throw notFound(`No characteristic ${characteristicId}.`);
  const range = await runRangeOf(db, window);
  const [[stats], limits, spec] = await Promise.all([
    db('measurements').where({ characteristic_id: characteristicId }).whereBetween('run_id', [range.fromRunId, range.toRunId])
      .select(db.raw('COUNT(*) AS n, MIN(run_id) AS first, MAX(run_id) AS last')),
    currentLimitsOf(db, characteristicId),
    specLimitsOf(db, characteristicId),
  ]);
  const total = Number(stats.n);
  const inForce = limits.frozen ?? limits.trial;
  const sampled = total > maxDisplayPoints;
  const values = sampled ? [] : await readValues(db, characteristicId, range);
  const signals = await db('signals').where({ characteristic_id: characteristicId }).whereBetween('first_run_id', [range.fromRunId, range.toRunId])
    .orderBy('id', 'desc').limit(200).select('id', 'rule', 'first_run_id', 'status');
  return {
    characteristic: { id: facts.id, code: facts.code, name: facts.name, unit: facts.unit, product: facts.product_code, spcEnabled: Boolean(facts.spc_enabled) },
    limits,
    spec,
    total,
    sampled,
    points: values,
    buckets: sampled ? await bucketsOf(db, characteristicId, range, Number(stats.first), Number(stats.last)) : [],
    violations: sampled ? [] : marks(values, inForce),
    signals: signals.map((s: { id: number; rule: string; first_run_id: number | string; status: string }) => ({ id: s.id, rule: s.rule, runId: Number(s.first_run_id), status: s.status })),
  };
}
