import type { Knex } from 'knex';

/** A window of runs, by id: runs are numbered in the order they were received. */
export type RunRange = { fromRunId: number; toRunId: number };
export type SeriesValue = { runId: number; value: number };
export type LotValue = SeriesValue & { lotId: number; lotCode: string };

const largest = Number.MAX_SAFE_INTEGER;

/**
 * Turns a time window into a run-id window, so the series itself is read from the covering index
 * (characteristic_id, run_id, value) alone. Each bound costs one step on test_runs(started_at).
 */
export async function runRangeOf(db: Knex, window: { from?: Date; to?: Date }): Promise<RunRange> {
  const [first, last] = await Promise.all([
    window.from ? db('test_runs').where('started_at', '>=', window.from).orderBy('started_at').first('id') : undefined,
    window.to ? db('test_runs').where('started_at', '<=', window.to).orderBy('started_at', 'desc').first('id') : undefined,
  ]);
  return {
    fromRunId: window.from ? (first ? Number(first.id) : largest) : 0,
    toRunId: window.to ? (last ? Number(last.id) : 0) : largest,
  };
}

export async function readValues(db: Knex, characteristicId: number, range: RunRange): Promise<SeriesValue[]> {
  const rows: Array<{ run_id: number | string; value: number }> = await db('measurements')
    .where({ characteristic_id: characteristicId }).whereBetween('run_id', [range.fromRunId, range.toRunId])
    .orderBy('run_id').select('run_id', 'value');
  return rows.map((row) => ({ runId: Number(row.run_id), value: row.value }));
}

/** Values with the lot of their run, for lot subgroups (a join, so only for bounded windows). */
export async function readValuesWithLots(db: Knex, characteristicId: number, range: RunRange): Promise<LotValue[]> {
  const rows: Array<{ run_id: number | string; value: number; lot_id: number; lot_code: string }> = await db('measurements as m')
    .join('test_runs as r', 'r.id', 'm.run_id').join('lots as l', 'l.id', 'r.lot_id')
    .where('m.characteristic_id', characteristicId).whereBetween('m.run_id', [range.fromRunId, range.toRunId])
    .orderBy('m.run_id').select('m.run_id', 'm.value', 'r.lot_id', 'l.code as lot_code');
  return rows.map((row) => ({ runId: Number(row.run_id), value: row.value, lotId: row.lot_id, lotCode: row.lot_code }));
}

/** Lots in first-seen order, each with its values: the rational subgroups of an X̄-S by lot. */
type LotGroup = { lotId: number; lotCode: string; firstRunId: number; lastRunId: number; values: number[] };

export function groupByLot(values: readonly LotValue[]): LotGroup[] {
  const lots = new Map<number, LotGroup>();
  for (const v of values) {
    const lot = lots.get(v.lotId) ?? { lotId: v.lotId, lotCode: v.lotCode, firstRunId: v.runId, lastRunId: v.runId, values: [] };
    lot.values.push(v.value);
    lot.lastRunId = v.runId;
    lots.set(v.lotId, lot);
  }
  return [...lots.values()];
}

/** Consecutive runs in groups of n; an incomplete last group is not yet a subgroup. */
export function groupConsecutive(values: readonly SeriesValue[], n: number): Array<{ firstRunId: number; runIds: number[]; values: number[] }> {
  const groups = [];
  for (let i = 0; i + n <= values.length; i += n) {
    const slice = values.slice(i, i + n);
    groups.push({ firstRunId: slice[0].runId, runIds: slice.map((v) => v.runId), values: slice.map((v) => v.value) });
  }
  return groups;
}
