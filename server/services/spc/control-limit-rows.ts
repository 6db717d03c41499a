import { jsonColumn } from '../../db/json-column.js';
import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import type { ChartKind, ChartParams, FrozenLimits, SignalRule } from './chart-kinds.js';
import type { Exclusions } from './baseline.js';

export type ControlLimitRow = {
  id: number; characteristic_id: number; chart_kind: ChartKind; subgroup_size: number | null;
  centre: number; ucl: number; lcl: number; sigma: number; rules_json: string | SignalRule[]; params_json: string | ChartParams;
  baseline_from_run_id: number | string; baseline_to_run_id: number | string; baseline_points: number;
  status: 'trial' | 'frozen' | 'superseded'; computed_by: string; computed_at: Date; frozen_by: string | null; frozen_at: Date | null;
};

type ExclusionRow = { run_id: number | string | null; lot_id: number | null; reason: string; excluded_by: string; excluded_at: Date };

const parsed = <T>(value: string | T): T => jsonColumn<T>(value);

export async function findLimitRow(db: Knex, id: number, options: { lock?: boolean } = {}): Promise<ControlLimitRow> {
  const query = db<ControlLimitRow>('control_limits').where({ id });
  const row = await (options.lock ? query.forUpdate() : query).first();
  if (!row) throw notFound(`No control limits ${id}.`);
  return row;
}

export async function exclusionRowsOf(db: Knex, limitId: number): Promise<ExclusionRow[]> {
  return db('control_limit_exclusions').where({ control_limit_id: limitId }).orderBy('id').select('run_id', 'lot_id', 'reason', 'excluded_by', 'excluded_at');
}

export function exclusionSets(rows: readonly ExclusionRow[]): Exclusions {
  return {
    runIds: new Set(rows.filter((r) => r.run_id !== null).map((r) => Number(r.run_id))),
    lotIds: new Set(rows.filter((r) => r.lot_id !== null).map((r) => Number(r.lot_id))),
  };
}

export function frozenLimitsOf(row: ControlLimitRow): FrozenLimits {
  return {
    limitId: row.id, kind: row.chart_kind, centre: row.centre, sigma: row.sigma, subgroupSize: row.subgroup_size,
    rules: parsed(row.rules_json), params: parsed(row.params_json),
  };
}

export function toLimitView(row: ControlLimitRow, exclusions: readonly ExclusionRow[] = []) {
  return {
    id: row.id,
    chartKind: row.chart_kind,
    subgroupSize: row.subgroup_size,
    status: row.status,
    centre: row.centre, ucl: row.ucl, lcl: row.lcl, sigma: row.sigma,
    rules: parsed<SignalRule[]>(row.rules_json),
    params: parsed<ChartParams>(row.params_json),
    baseline: { fromRunId: Number(row.baseline_from_run_id), toRunId: Number(row.baseline_to_run_id), points: row.baseline_points },
    computedBy: row.computed_by, computedAt: row.computed_at.toISOString(),
    frozenBy: row.frozen_by, frozenAt: row.frozen_at ? row.frozen_at.toISOString() : null,
    exclusions: exclusions.map((e) => ({
      runId: e.run_id === null ? null : Number(e.run_id), lotId: e.lot_id, reason: e.reason, excludedBy: e.excluded_by, excludedAt: e.excluded_at.toISOString(),
    })),
  };
}
export type ControlLimitView = ReturnType<typeof toLimitView>;

/** The trial limits being worked on and the frozen limits in force, each the latest of its kind. */
export async function currentLimitsOf(db: Knex, characteristicId: number) {
  const [trial, frozen] = await Promise.all((['trial', 'frozen'] as const).map((status) =>
    db<ControlLimitRow>('control_limits').where({ characteristic_id: characteristicId, status }).orderBy('id', 'desc').first()));
  return {
    trial: trial ? toLimitView(trial, await exclusionRowsOf(db, trial.id)) : null,
    frozen: frozen ? toLimitView(frozen, await exclusionRowsOf(db, frozen.id)) : null,
  };
}
