import { jsonColumn } from '../../db/json-column.js';
import type { Knex } from 'knex';
import { openSignal } from '../signals/open-signal.js';
import { recordDisplayBlocks } from './display-blocks.js';
import { phaseTwoStep, type SpcStateData } from './phase-two-step.js';
import type { SignalRule } from './chart-kinds.js';

export type IngestedRun = {
  runId: number; motorId: number; lotId: number; productId: number; startedAt: Date | string;
  /** When the run was received: the time of any signal it opens. */
  receivedAt: Date;
  measurements: ReadonlyArray<{ characteristicId: number; value: number }>;
};

export type SpcOutcome = { openedSignalIds: number[] };

type StateRow = { characteristic_id: number; control_limit_id: number; state_json: string | SpcStateData };

/**
 * Judges freshly stored runs (one ingest batch) against the frozen control limits of the
 * characteristics they touched, inside the ingest transaction. One locked read of their spc_state
 * rows (in key order, so concurrent ingests queue instead of deadlocking), each characteristic's
 * values stepped through in run order, and one batched write back; signals only when a rule is
 * broken. A rule broken again at the next plotted point continues its episode; broken after an
 * in-control point it opens a new signal. Characteristics without frozen limits have no spc_state
 * row and cost nothing; every characteristic's value also joins the chart's display summary.
 */
export async function evaluateSpcAfterIngest(trx: Knex.Transaction, runs: readonly IngestedRun[]): Promise<SpcOutcome> {
  const inRunOrder = [...runs].sort((a, b) => a.runId - b.runId);
  const outcome = await judgeAgainstFrozenLimits(trx, inRunOrder);
  // After the spc_state locks, so every ingest takes its locks in the same order.
  await recordDisplayBlocks(trx, inRunOrder.flatMap((run) => run.measurements.map((m) => ({ runId: run.runId, characteristicId: m.characteristicId, value: m.value }))));
  return outcome;
}

type Episodes = { openedSignalIds: number[]; continued: Array<{ signal_id: number; run_id: number }> };

async function judgeAgainstFrozenLimits(trx: Knex.Transaction, runs: readonly IngestedRun[]): Promise<SpcOutcome> {
  const characteristicIds = [...new Set(runs.flatMap((run) => run.measurements.map((m) => m.characteristicId)))];
  if (characteristicIds.length === 0) return { openedSignalIds: [] };
  const rows: StateRow[] = await trx('spc_state')
    .whereIn('characteristic_id', characteristicIds)
    // Not a locking read of characteristics: a subquery is read consistently, only spc_state is locked.
    .whereExists((q) => q.select(trx.raw('1')).from('characteristics').whereRaw('characteristics.id = spc_state.characteristic_id').andWhere('spc_enabled', true))
    .orderBy('characteristic_id')
    .forUpdate()
    .select('characteristic_id', 'control_limit_id', 'state_json');
  if (rows.length === 0) return { openedSignalIds: [] };

  const episodes: Episodes = { openedSignalIds: [], continued: [] };
  const updates = [];
  for (const row of rows) {
    let state = jsonColumn<SpcStateData>(row.state_json);
    let last: IngestedRun | undefined;
    for (const run of runs) {
      const measured = run.measurements.find((m) => m.characteristicId === row.characteristic_id);
      if (!measured) continue;
      state = await judgeOneValue(trx, row, state, run, measured.value, episodes);
      last = run;
    }
    if (!last) continue;
    updates.push({ characteristic_id: row.characteristic_id, control_limit_id: row.control_limit_id, state_json: JSON.stringify(state), last_run_id: last.runId, updated_at: last.receivedAt });
  }
  if (episodes.continued.length > 0) await trx('signal_points').insert(episodes.continued).onConflict(['signal_id', 'run_id']).ignore();
  if (updates.length > 0) await trx('spc_state').insert(updates).onConflict('characteristic_id').merge(['state_json', 'last_run_id', 'updated_at']);
  return { openedSignalIds: episodes.openedSignalIds };
}

/** One Phase II step of one characteristic: the next state, with a signal opened or continued per broken rule. */
async function judgeOneValue(
  trx: Knex.Transaction, row: StateRow, state: SpcStateData, run: IngestedRun, value: number, out: Episodes,
): Promise<SpcStateData> {
  const step = phaseTwoStep(state, { runId: run.runId, lotId: run.lotId, value });
  const next = step.state;
  if (!step.judged) return next;
  const episodes: Partial<Record<SignalRule, number>> = {};
  for (const broken of step.judged.broken) {
    const ongoing = state.episodes[broken.rule];
    if (ongoing !== undefined) {
      episodes[broken.rule] = ongoing;
      out.continued.push({ signal_id: ongoing, run_id: run.runId });
      continue;
    }
    const signal = await openSignal(trx, {
      characteristicId: row.characteristic_id, productId: run.productId, controlLimitId: row.control_limit_id, rule: broken.rule,
      lotId: step.judged.lotId, firstRunId: step.judged.firstRunId, patternFirstRunId: broken.patternFirstRunId, at: run.receivedAt,
    });
    episodes[broken.rule] = signal.id;
    if (signal.created) out.openedSignalIds.push(signal.id);
  }
  next.episodes = episodes;
  return next;
}
