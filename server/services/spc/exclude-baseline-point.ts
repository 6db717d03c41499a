import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict, invalid } from '../../errors.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf } from '../setup/actor.js';
import { calculateLimits } from './baseline.js';
import { exclusionRowsOf, exclusionSets, findLimitRow, frozenLimitsOf, toLimitView, type ControlLimitView } from './control-limit-rows.js';

export type ExclusionInput = { runId?: number; lotId?: number; reason: string };

/**
 * Leaves a baseline point with an assignable cause out of the trial limits and recomputes them
 * over the same window. Only trial limits change; frozen limits are history.
 */
export async function excludeBaselinePoint(db: Knex, user: SessionUser, limitId: number, input: ExclusionInput, now = new Date()): Promise<ControlLimitView> {
  return db.transaction(async (trx) => {
    const row = await findLimitRow(trx, limitId, { lock: true });
    if (row.status !== 'trial') throw conflict(`Control limits ${limitId} are ${row.status}; only trial limits take exclusions.`);
    const byLot = row.chart_kind === 'xbar-s-lot';
    if (byLot ? input.lotId === undefined : input.runId === undefined) {
      throw invalid([{ field: byLot ? 'lotId' : 'runId', message: byLot ? 'a lot subgroup chart excludes whole lots' : 'name the run whose point is excluded' }]);
    }
    const inserted = await trx('control_limit_exclusions').insert({
      control_limit_id: limitId, run_id: byLot ? null : input.runId, lot_id: byLot ? input.lotId : null,
      reason: input.reason, excluded_by: user.name, excluded_at: now,
    }).onConflict(byLot ? ['control_limit_id', 'lot_id'] : ['control_limit_id', 'run_id']).ignore();
    if (inserted.length === 0 || Number(inserted[0]) === 0) throw conflict('That point is already excluded.');
    const exclusions = await exclusionRowsOf(trx, limitId);
    const window = { fromRunId: Number(row.baseline_from_run_id), toRunId: Number(row.baseline_to_run_id) };
    const limits = await calculateLimits(trx, row.characteristic_id, row.chart_kind, row.subgroup_size, frozenLimitsOf(row).params, window, exclusionSets(exclusions));
    await trx('control_limits').where({ id: limitId }).update({ centre: limits.centre, ucl: limits.ucl, lcl: limits.lcl, sigma: limits.sigma, baseline_points: limits.points });
    const after = toLimitView(await findLimitRow(trx, limitId), exclusions);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'control-limits.point-excluded', entityType: 'characteristic', entityId: row.characteristic_id,
      before: { limitId, centre: row.centre, ucl: row.ucl, lcl: row.lcl }, after: { limitId, runId: input.runId ?? null, lotId: input.lotId ?? null, centre: after.centre, ucl: after.ucl, lcl: after.lcl },
      reason: input.reason, at: now,
    });
    return after;
  });
}
