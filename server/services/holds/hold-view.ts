import type { Knex } from 'knex';

export type HoldKind = 'manual' | 'calibration' | 'signal';
export type HoldTarget = { type: 'motor'; serial: string } | { type: 'lot'; code: string };
export type HoldView = {
  id: number; target: HoldTarget; kind: HoldKind; reason: string; signalId: number | null;
  placedBy: string; placedAt: string; releasedBy: string | null; releasedAt: string | null; releaseReason: string | null;
};

export type HoldRow = {
  id: number; kind: HoldKind; reason: string; signal_id: number | null; placed_by: string; placed_at: Date;
  released_by: string | null; released_at: Date | null; release_reason: string | null;
  motor_serial: string | null; lot_code: string | null;
};

/** Holds with the serial or lot code they apply to; the caller narrows the query. */
export function holdsQuery(db: Knex): Knex.QueryBuilder {
  return db('holds')
    .leftJoin('motors', 'motors.id', 'holds.motor_id')
    .leftJoin('lots', 'lots.id', 'holds.lot_id')
    .select('holds.*', 'motors.serial as motor_serial', 'lots.code as lot_code')
    .orderBy('holds.id', 'desc');
}

export function toHoldView(row: HoldRow): HoldView {
  return {
    id: row.id,
    target: row.motor_serial !== null ? { type: 'motor', serial: row.motor_serial } : { type: 'lot', code: row.lot_code ?? '' },
    kind: row.kind, reason: row.reason, signalId: row.signal_id,
    placedBy: row.placed_by, placedAt: row.placed_at.toISOString(),
    releasedBy: row.released_by, releasedAt: row.released_at?.toISOString() ?? null, releaseReason: row.release_reason,
  };
}
