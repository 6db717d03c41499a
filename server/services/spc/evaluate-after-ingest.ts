import { jsonColumn } from '../../db/json-column.js';
import type { Knex } from 'knex';
import { openSignal } from '../signals/open-signal.js';
import { recordDisplayBlocks } from './display-blocks.js';
import { phaseTwoStep, type SpcStateData } from './phase-two-step.js';
import type { SignalRule } from './chart-kinds.js';

export type IngestedRun = {
  runId: number; motorId: number; lotId: number; productId: number; startedAt: Date | string;
  measurements: Array<{ characteristicId: number; value: number }>;
};

export type SpcOutcome = { openedSignalIds: number[] };

type StateRow = { characteristic_id: number; control_limit_id: number; state_json: string | SpcStateData };

/**
 * Judges a freshly stored run against the frozen control limits of the characteristics it
 * touched, inside the ingest transaction. One locked read of their spc_state rows (in key order,
 * so concurrent ingests queue instead of deadlocking) and one batched write back; signals only
 * when a rule is broken. A rule broken again at the next plotted point continues its episode;
 * broken after an in-control point it opens a new signal. Characteristics without frozen limits
 * have no spc_state row and cost nothing; every characteristic's value also joins the chart's
 * display summary.
 */
export async function evaluateSpcAfterIngest(trx: Knex.Transaction, run: IngestedRun, now = new Date()): Promise<SpcOutcome> {
  const outcome = await judgeAgainstFrozenLimits(trx, run, now);
  // After the spc_state locks, so every ingest takes its locks in the same order.
  await recordDisplayBlocks(trx, run.runId, run.measurements);
  return outcome;
}

async function judgeAgainstFrozenLimits(trx: Knex.Transaction, run: IngestedRun, now: Date): Promise<SpcOutcome> {
  const values = new Map(run.measurements.map((m) => [m.characteristicId, m.value]));
  if (values.size === 0) return { openedSignalIds: [] };
  const rows: StateRow[] = await trx('spc_state')
    .whereIn('characteristic_id', [...values.keys()])
    // Not a locking read of characteristics: a subquery is read consistently, only spc_state is locked.
    .whereExists((q) => q.select(trx.raw('1')).from('characteristics').whereRaw('characteristics.id = spc_state.characteristic_id').andWhere('spc_enabled', true))
    .orderBy('characteristic_id')
    .forUpdate()
    .select('characteristic_id', 'control_limit_id', 'state_json');
  if (rows.length === 0) return { openedSignalIds: [] };

  const openedSignalIds: number[] = [];
  const continued: Array<{ signal_id: number; run_id: number }> = [];
  const updates = [];
  for (const row of rows) {
    const state = jsonColumn<SpcStateData>(row.state_json);
    const step = phaseTwoStep(state, { runId: run.runId, lotId: run.lotId, value: values.get(row.characteristic_id) as number });
    const next = step.state;
    if (step.judged) {
      const episodes: Partial<Record<SignalRule, number>> = {};
      for (const broken of step.judged.broken) {
        const ongoing = state.episodes[broken.rule];
        if (ongoing !== undefined) {
          episodes[broken.rule] = ongoing;
          continued.push({ signal_id: ongoing, run_id: run.runId });
          continue;
        }
        const signal = await openSignal(trx, {
          characteristicId: row.characteristic_id, productId: run.productId, controlLimitId: row.control_limit_id, rule: broken.rule,
          lotId: step.judged.lotId, firstRunId: step.judged.firstRunId, patternFirstRunId: broken.patternFirstRunId, at: now,
        });
        episodes[broken.rule] = signal.id;
        if (signal.created) openedSignalIds.push(signal.id);
      }
      next.episodes = episodes;
    }
    updates.push({ characteristic_id: row.characteristic_id, control_limit_id: row.control_limit_id, state_json: JSON.stringify(next), last_run_id: run.runId, updated_at: now });
  }
  if (continued.length > 0) await trx('signal_points').insert(continued).onConflict(['signal_id', 'run_id']).ignore();
  await trx('spc_state').insert(updates).onConflict('characteristic_id').merge(['state_json', 'last_run_id', 'updated_at']);
  return { openedSignalIds };
}
