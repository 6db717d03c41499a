import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict } from '../../errors.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf } from '../setup/actor.js';
import { exclusionRowsOf, findLimitRow, frozenLimitsOf, toLimitView, type ControlLimitView } from './control-limit-rows.js';
import { freshState } from './phase-two-step.js';

/**
 * Phase II starts: the trial limits become the limits new data is judged against. The limits
 * frozen before are superseded, and the characteristic's evaluation state starts afresh (an
 * empty window: points judged against old limits say nothing about the new ones).
 */
export async function freezeControlLimits(db: Knex, user: SessionUser, limitId: number, now = new Date()): Promise<ControlLimitView> {
  return db.transaction(async (trx) => {
    // Locks in ingest's order: the characteristic's SPC state first, then its control limits. An
    // ingest batch holds the state and then writes rows whose keys name the frozen limits (the
    // state itself, signals); taking the limits first would deadlock with it.
    const { characteristic_id: characteristicId } = await findLimitRow(trx, limitId);
    await trx('spc_state').where({ characteristic_id: characteristicId }).forUpdate().first('characteristic_id');
    const row = await findLimitRow(trx, limitId, { lock: true });
    if (row.status !== 'trial') throw conflict(`Control limits ${limitId} are ${row.status}; only trial limits can be frozen.`);
    const previous = await trx('control_limits').where({ characteristic_id: row.characteristic_id, status: 'frozen' }).first('id');
    await trx('control_limits').where({ characteristic_id: row.characteristic_id, status: 'frozen' }).update({ status: 'superseded' });
    await trx('control_limits').where({ id: limitId }).update({ status: 'frozen', frozen_by: user.name, frozen_at: now });
    const frozen = await findLimitRow(trx, limitId);
    await trx('spc_state')
      .insert({ characteristic_id: row.characteristic_id, control_limit_id: limitId, state_json: JSON.stringify(freshState(frozenLimitsOf(frozen))), last_run_id: null, updated_at: now })
      .onConflict('characteristic_id').merge(['control_limit_id', 'state_json', 'last_run_id', 'updated_at']);
    const view = toLimitView(frozen, await exclusionRowsOf(trx, limitId));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'control-limits.frozen', entityType: 'characteristic', entityId: row.characteristic_id,
      before: { limitId, status: 'trial', replacesLimitId: previous?.id ?? null },
      after: {
        limitId, status: 'frozen', chartKind: view.chartKind, centre: view.centre, ucl: view.ucl, lcl: view.lcl, sigma: view.sigma,
        rules: view.rules, baseline: view.baseline, exclusions: view.exclusions.length, frozenBy: user.name, frozenAt: now.toISOString(),
      },
      at: now,
    });
    return view;
  });
}
