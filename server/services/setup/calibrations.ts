import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { invalid } from '../../errors.js';
import type { CalibrationInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, isoDay, reasonOf } from './actor.js';
import { findStationRow, toStation } from './stations.js';
import { changeReferenceData } from './change-reference-data.js';

type CalibrationRow = { id: number; station_id: number; calibrated_on: Date; due: Date; certificate: string | null; recorded_by: string; recorded_at: Date };

function toCalibration(row: CalibrationRow) {
  return {
    id: row.id, calibratedOn: isoDay(row.calibrated_on), due: isoDay(row.due), certificate: row.certificate,
    recordedBy: row.recorded_by, recordedAt: row.recorded_at.toISOString(),
  };
}

/** A station's calibration history, latest first. */
export async function listCalibrations(db: Knex, stationCode: string) {
  const station = await findStationRow(db, stationCode);
  const rows = await db<CalibrationRow>('station_calibrations').where({ station_id: station.id })
    .orderBy([{ column: 'calibrated_on', order: 'desc' }, { column: 'id', order: 'desc' }]);
  return rows.map(toCalibration);
}

/**
 * Records a calibration and moves the station's due date to it, in one transaction, so every
 * due date the runs were judged against can be traced to a certificate.
 */
export async function recordCalibration(db: Knex, user: SessionUser, stationCode: string, input: CalibrationInput, now = new Date()) {
  if (input.calibratedOn > isoDay(now)) throw invalid([{ field: 'calibratedOn', message: 'Must not be in the future' }]);
  return changeReferenceData(db, async (trx) => {
    const row = await findStationRow(trx, stationCode, { lock: true });
    const before = toStation(row, now);
    const [id] = await trx('station_calibrations').insert({
      station_id: row.id, calibrated_on: input.calibratedOn, due: input.due, certificate: input.certificate || null,
      recorded_by: user.name, recorded_at: now,
    });
    await trx('stations').where({ id: row.id }).update({ calibration_due: input.due });
    const station = toStation(await findStationRow(trx, stationCode), now);
    const calibration = toCalibration(await trx<CalibrationRow>('station_calibrations').where({ id }).first() as CalibrationRow);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'station.calibration_recorded', entityType: 'station', entityId: stationCode,
      before, after: { ...station, calibration }, reason: reasonOf(input.reason), at: now,
    });
    return { station, calibration };
  });
}
