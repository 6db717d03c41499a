import type { Knex } from 'knex';
import { findLimitRow, toLimitView } from '../spc/control-limit-rows.js';
import { affectedLotIds, affectedMotors } from './affected-motors.js';
import { findSignal, toSignalSummary } from './signal-rows.js';

const before = 60;
const after = 40;

/** The values around an episode, read from the covering index in two short steps. */
async function valuesAround(db: Knex, characteristicId: number, fromRunId: number, toRunId: number) {
  const [earlier, within] = await Promise.all([
    db('measurements').where({ characteristic_id: characteristicId }).andWhere('run_id', '<', fromRunId).orderBy('run_id', 'desc').limit(before).select('run_id', 'value'),
    db('measurements').where({ characteristic_id: characteristicId }).andWhere('run_id', '>=', fromRunId).orderBy('run_id').limit(after + 500).select('run_id', 'value'),
  ]);
  const lastInEpisode = within.findIndex((r: { run_id: number }) => Number(r.run_id) > toRunId);
  const kept = lastInEpisode === -1 ? within : within.slice(0, lastInEpisode + after);
  return [...earlier.reverse(), ...kept].map((r: { run_id: number | string; value: number }) => ({ runId: Number(r.run_id), value: r.value }));
}

/** Everything the signal page shows: the signal, its chart, lots, affected motors and holds. */
export async function getSignal(db: Knex, id: number) {
  const row = await findSignal(db, id);
  const [points, lotIds, motors, limits] = await Promise.all([
    db('signal_points').where({ signal_id: id }).orderBy('run_id').select('run_id'),
    affectedLotIds(db, row),
    affectedMotors(db, row),
    findLimitRow(db, row.control_limit_id),
  ]);
  const episodeRunIds = [Number(row.first_run_id), ...points.map((p: { run_id: number | string }) => Number(p.run_id))];
  const lastRunId = Math.max(...episodeRunIds);
  const lots: Array<{ code: string }> = await db('lots').whereIn('id', lotIds).orderBy('code').select('code');
  return {
    signal: toSignalSummary(row),
    episode: { runIds: episodeRunIds, patternFirstRunId: Number(row.pattern_first_run_id), lastRunId },
    limits: toLimitView(limits),
    series: await valuesAround(db, row.characteristic_id, Number(row.pattern_first_run_id), lastRunId),
    lots: lots.map((l) => l.code),
    motors,
  };
}
