import type { Knex } from 'knex';
import type { RuleName } from '../../analysis/spc/index.js';
import type { SessionUser } from '../../auth/session.js';
import { notFound } from '../../errors.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf } from '../setup/actor.js';
import { calculateLimits } from './baseline.js';
import { rulesFor, type ChartKind, type ChartParams } from './chart-kinds.js';
import { findLimitRow, toLimitView, type ControlLimitView } from './control-limit-rows.js';
import { runRangeOf } from './series.js';

export type TrialLimitsInput = {
  chartKind: ChartKind; subgroupSize?: number; from?: Date; to?: Date; rules?: RuleName[]; params?: ChartParams;
};

/**
 * Phase I: trial limits from a chosen baseline window. Earlier trial limits of the characteristic
 * are superseded; frozen limits stay in force until these are frozen in their place.
 */
export async function computeTrialLimits(db: Knex, user: SessionUser, characteristicId: number, input: TrialLimitsInput, now = new Date()): Promise<ControlLimitView> {
  const characteristic = await db('characteristics').where({ id: characteristicId }).first('id');
  if (!characteristic) throw notFound(`No characteristic ${characteristicId}.`);
  const subgroupSize = input.chartKind === 'xbar-s-consecutive' ? input.subgroupSize ?? 5 : null;
  const range = await runRangeOf(db, input);
  const limits = await calculateLimits(db, characteristicId, input.chartKind, subgroupSize, input.params ?? {}, range, { runIds: new Set(), lotIds: new Set() });
  const rules = rulesFor(input.chartKind, input.rules);
  return db.transaction(async (trx) => {
    await trx('control_limits').where({ characteristic_id: characteristicId, status: 'trial' }).update({ status: 'superseded' });
    const [id] = await trx('control_limits').insert({
      characteristic_id: characteristicId, chart_kind: input.chartKind, subgroup_size: subgroupSize,
      centre: limits.centre, ucl: limits.ucl, lcl: limits.lcl, sigma: limits.sigma,
      rules_json: JSON.stringify(rules), params_json: JSON.stringify(limits.params),
      baseline_from_run_id: limits.fromRunId, baseline_to_run_id: limits.toRunId, baseline_points: limits.points,
      status: 'trial', computed_by: user.name, computed_at: now,
    });
    const view = toLimitView(await findLimitRow(trx, Number(id)));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'control-limits.trial-computed', entityType: 'characteristic', entityId: characteristicId,
      after: { limitId: view.id, chartKind: view.chartKind, centre: view.centre, ucl: view.ucl, lcl: view.lcl, sigma: view.sigma, rules, baseline: view.baseline }, at: now,
    });
    return view;
  });
}
