import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict, invalid, notFound } from '../../errors.js';
import type { StationCreateInput, StationUpdateInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, isoDay, reasonOf } from './actor.js';
import { changeReferenceData } from './change-reference-data.js';

export type StationRow = { id: number; code: string; line: string; kind: string; name: string; calibration_due: Date; active: number | boolean };
export type CalibrationState = 'valid' | 'due-soon' | 'expired';

/** A fortnight's notice leaves time to book the calibration lab before the stand must stop. */
const DUE_SOON_DAYS = 14;

/** Valid through the due date itself; expired from the day after. */
export function calibrationStateOf(dueDay: string, today: string): CalibrationState {
  if (dueDay < today) return 'expired';
  const soon = new Date(`${today}T00:00:00Z`);
  soon.setUTCDate(soon.getUTCDate() + DUE_SOON_DAYS);
  return dueDay <= isoDay(soon) ? 'due-soon' : 'valid';
}

export function toStation(row: StationRow, now: Date) {
  const calibrationDue = isoDay(row.calibration_due);
  return {
    code: row.code, line: row.line, kind: row.kind, name: row.name, active: Boolean(row.active),
    calibrationDue, calibrationState: calibrationStateOf(calibrationDue, isoDay(now)),
  };
}

export async function findStationRow(db: Knex, code: string, options: { lock?: boolean } = {}): Promise<StationRow> {
  const query = db<StationRow>('stations').where({ code }).first();
  const row = await (options.lock ? query.forUpdate() : query);
  if (!row) throw notFound(`No station with the code ${code}.`);
  return row;
}

export async function listStations(db: Knex, now = new Date()) {
  const rows = await db<StationRow>('stations').orderBy([{ column: 'line' }, { column: 'code' }]);
  return rows.map((row) => toStation(row, now));
}

export async function createStation(db: Knex, user: SessionUser, input: StationCreateInput, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    if (await trx('stations').where({ code: input.code }).first()) {
      throw conflict(`A station with the code ${input.code} exists already.`, [{ field: 'code', message: 'Already in use' }]);
    }
    await trx('stations').insert({
      code: input.code, line: input.line, kind: input.kind, name: input.name, active: input.active, calibration_due: input.calibrationDue,
    });
    const station = toStation(await findStationRow(trx, input.code), now);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'station.created', entityType: 'station', entityId: input.code,
      after: station, reason: reasonOf(input.reason), at: now,
    });
    return station;
  });
}

/**
 * Edits a station. The calibration history is never touched: a due date moved here stands beside
 * it with its reason in the audit trail, which is why that move must give one.
 */
export async function updateStation(db: Knex, user: SessionUser, code: string, input: StationUpdateInput, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    const before = toStation(await findStationRow(trx, code, { lock: true }), now);
    if (input.calibrationDue !== before.calibrationDue && !reasonOf(input.reason)) {
      throw invalid([{ field: 'reason', message: 'Say why the calibration due date moves without a recorded calibration' }]);
    }
    await trx('stations').where({ code }).update({
      line: input.line, kind: input.kind, name: input.name, active: input.active, calibration_due: input.calibrationDue,
    });
    const after = toStation(await findStationRow(trx, code), now);
    await recordAudit(trx, {
      actor: actorOf(user), action: 'station.updated', entityType: 'station', entityId: code,
      before, after, reason: reasonOf(input.reason), at: now,
    });
    return after;
  });
}
