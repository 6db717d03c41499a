import { jsonColumn } from '../../db/json-column.js';
import type { Knex } from 'knex';
import { openSignal } from '../signals/open-signal.js';
import { displayBlocksStatement } from './display-blocks.js';
import { TransactionNeeded, type Statement } from '../../db/statements.js';
import { StatementTemplates, valueList } from '../../db/statement-templates.js';
import { phaseTwoStep, type BrokenRule, type SpcStateData } from './phase-two-step.js';
import type { SignalRule } from './chart-kinds.js';

export type IngestedRun = {
  runId: number; motorId: number; lotId: number; productId: number; startedAt: Date | string;
  /** When the run was received: the time of any signal it opens. */
  receivedAt: Date;
  measurements: ReadonlyArray<{ characteristicId: number; value: number }>;
};

export type SpcStateRow = { characteristic_id: number; control_limit_id: number; state_json: string | SpcStateData };

/** The SPC state rows of these characteristics that judge values (SPC on, limits frozen), in key order. */
function spcStateQuery(db: Knex, characteristicIds: ReadonlyArray<number | string>) {
  return db('spc_state')
    .whereIn('characteristic_id', characteristicIds.length > 0 ? characteristicIds : [0])
    .whereExists((q) => q.select(db.raw('1')).from('characteristics').whereRaw('characteristics.id = spc_state.characteristic_id').andWhere('spc_enabled', true))
    .orderBy('characteristic_id')
    .select('characteristic_id', 'control_limit_id', 'state_json');
}

/**
 * The locking read of the SPC state of these characteristics, in key order so that concurrent
 * ingests queue instead of deadlocking. Characteristics without frozen limits (or with SPC off)
 * have no row here and cost nothing. Not a locking read of characteristics: the subquery is read
 * consistently, only spc_state is locked.
 */
export function spcStateLockStatement(db: Knex, characteristicIds: readonly number[]): Statement {
  return spcStateLockTemplates.statements(db, characteristicIds.length, characteristicIds)[0];
}

/** The same rows read without a lock, to foresee whether a batch opens a signal (signalWouldOpen). */
export function spcStateReadStatement(db: Knex, characteristicIds: readonly number[]): Statement {
  return spcStateReadTemplates.statements(db, characteristicIds.length, characteristicIds)[0];
}

// Built once per number of characteristics (every ingest batch reads them).
const spcStateReadTemplates = new StatementTemplates<number>((db, count, value) => [spcStateQuery(db, valueList(count, value)).toSQL()]);
const spcStateLockTemplates = new StatementTemplates<number>((db, count, value) => [spcStateQuery(db, valueList(count, value)).forUpdate().toSQL()]);

/**
 * Whether judging these runs, in run order, from these states would open a signal (a rule broken
 * with no episode of it going on). Writes nothing: the ingest writer asks it with the states as read
 * at the start of a batch, to choose a transaction that can open signals before it writes anything.
 */
export function signalWouldOpen(runs: readonly IngestedRun[], stateRows: readonly SpcStateRow[]): boolean {
  const inRunOrder = [...runs].sort((a, b) => a.runId - b.runId);
  for (const row of stateRows) {
    let state = jsonColumn<SpcStateData>(row.state_json);
    for (const run of inRunOrder) {
      const measured = run.measurements.find((m) => m.characteristicId === row.characteristic_id);
      if (!measured) continue;
      const step = stepWithEpisodes(state, run, measured.value);
      if (step.opening.length > 0) return true;
      state = step.next;
    }
  }
  return false;
}

/**
 * One Phase II step with its episodes: the next state, with the episodes that go on (a rule broken
 * again at the next plotted point) kept in it, and the rules broken afresh, each of which opens a
 * signal. The given state is left as it was.
 */
function stepWithEpisodes(state: SpcStateData, run: IngestedRun, value: number) {
  const step = phaseTwoStep(state, { runId: run.runId, lotId: run.lotId, value });
  if (!step.judged) return { next: step.state, judged: null, continued: [] as number[], opening: [] as BrokenRule[] };
  const episodes: Partial<Record<SignalRule, number>> = {};
  const continued: number[] = [];
  const opening: BrokenRule[] = [];
  for (const broken of step.judged.broken) {
    const ongoing = state.episodes[broken.rule];
    if (ongoing === undefined) opening.push(broken);
    else {
      episodes[broken.rule] = ongoing;
      continued.push(ongoing);
    }
  }
  return { next: { ...step.state, episodes }, judged: step.judged, continued, opening };
}

/**
 * Judges freshly stored runs (one ingest batch) against the frozen control limits of the
 * characteristics they touched, inside the ingest transaction, given their spc_state rows as
 * locked by spcStateLockStatement: each characteristic's values are stepped through in run order;
 * signals only when a rule is broken (opened at once in `trx`, rare; without one, TransactionNeeded). A rule broken again at the next plotted
 * point continues its episode; broken after an in-control point it opens a new signal. Returns the
 * statements that write the new states, the continued episodes and every value's place in the
 * chart's display summary, to be sent together with the batch's other writes.
 */
export async function spcStatementsAfterIngest(
  db: Knex, trx: Knex.Transaction | null, runs: readonly IngestedRun[], stateRows: readonly SpcStateRow[],
): Promise<{ statements: Statement[]; openedSignalIds: number[] }> {
  const inRunOrder = [...runs].sort((a, b) => a.runId - b.runId);
  const episodes: Episodes = { openedSignalIds: [], continued: [] };
  const updates = [];
  for (const row of stateRows) {
    let state = jsonColumn<SpcStateData>(row.state_json);
    let last: IngestedRun | undefined;
    for (const run of inRunOrder) {
      const measured = run.measurements.find((m) => m.characteristicId === row.characteristic_id);
      if (!measured) continue;
      state = await judgeOneValue(trx, row, state, run, measured.value, episodes);
      last = run;
    }
    if (!last) continue;
    updates.push({ characteristic_id: row.characteristic_id, control_limit_id: row.control_limit_id, state_json: JSON.stringify(state), last_run_id: last.runId, updated_at: last.receivedAt });
  }
  const statements: Statement[] = [];
  if (episodes.continued.length > 0) statements.push(db('signal_points').insert(episodes.continued).onConflict(['signal_id', 'run_id']).ignore().toSQL());
  if (updates.length > 0) statements.push(db('spc_state').insert(updates).onConflict('characteristic_id').merge(['state_json', 'last_run_id', 'updated_at']).toSQL());
  const display = displayBlocksStatement(inRunOrder.flatMap((run) => run.measurements.map((m) => ({ runId: run.runId, characteristicId: m.characteristicId, value: m.value }))));
  if (display) statements.push(display);
  return { statements, openedSignalIds: episodes.openedSignalIds };
}

type Episodes = { openedSignalIds: number[]; continued: Array<{ signal_id: number; run_id: number }> };

/** One Phase II step of one characteristic: the next state, with a signal opened or continued per broken rule. */
async function judgeOneValue(
  trx: Knex.Transaction | null, row: SpcStateRow, state: SpcStateData, run: IngestedRun, value: number, out: Episodes,
): Promise<SpcStateData> {
  const { next, judged, continued, opening } = stepWithEpisodes(state, run, value);
  for (const signalId of continued) out.continued.push({ signal_id: signalId, run_id: run.runId });
  if (!judged || opening.length === 0) return next;
  // Opening a signal writes the audit chain, which reads as it goes: that needs a knex transaction.
  if (!trx) throw new TransactionNeeded('an SPC signal opens');
  for (const broken of opening) {
    const signal = await openSignal(trx, {
      characteristicId: row.characteristic_id, productId: run.productId, controlLimitId: row.control_limit_id, rule: broken.rule,
      lotId: judged.lotId, firstRunId: judged.firstRunId, patternFirstRunId: broken.patternFirstRunId, at: run.receivedAt,
    });
    next.episodes[broken.rule] = signal.id;
    if (signal.created) out.openedSignalIds.push(signal.id);
  }
  return next;
}
