import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { componentsOfLot, type LotComponentView } from '../lots/lot-components.js';
import { holdsQuery, toHoldView, type HoldView } from '../holds/hold-view.js';
import { runsOfMotor, type RunView } from './motor-runs.js';
import { auditEventsOf, type AuditEventView } from './entity-audit-events.js';
import type { MotorStatus } from './list-motors.js';

export type ReworkNoteView = { id: number; action: 'rework' | 'retest'; note: string; recordedBy: string; recordedAt: string };
export type MotorRecord = {
  serial: string;
  product: { code: string; name: string; motorKind: string };
  lot: { code: string; components: LotComponentView[] };
  status: MotorStatus;
  holds: HoldView[];
  reworkNotes: ReworkNoteView[];
  runs: RunView[];
  auditEvents: AuditEventView[];
};

/** Everything recorded about one serial: product, lot, holds (its own and its lot's), runs, notes, audit. */
export async function getMotor(db: Knex, serial: string): Promise<MotorRecord> {
  const motor = await db('motors').join('products', 'products.id', 'motors.product_id').join('lots', 'lots.id', 'motors.lot_id')
    .where('motors.serial', serial)
    .first('motors.id', 'motors.serial', 'motors.status', 'motors.lot_id', 'lots.code as lot_code',
      'products.code as product_code', 'products.name as product_name', 'products.motor_kind');
  if (!motor) throw notFound(`No motor with serial ${serial}.`);
  const [components, holds, notes, runs, auditEvents] = await Promise.all([
    componentsOfLot(db, motor.lot_id),
    holdsQuery(db).where((q) => q.where('holds.motor_id', motor.id).orWhere('holds.lot_id', motor.lot_id)),
    db('rework_notes').where({ motor_id: motor.id }).orderBy('id', 'desc'),
    runsOfMotor(db, motor.id),
    auditEventsOf(db, [{ type: 'motor', id: motor.serial }, { type: 'lot', id: motor.lot_code }]),
  ]);
  return {
    serial: motor.serial,
    product: { code: motor.product_code, name: motor.product_name, motorKind: motor.motor_kind },
    lot: { code: motor.lot_code, components },
    status: motor.status,
    holds: holds.map(toHoldView),
    reworkNotes: notes.map((n) => ({ id: n.id, action: n.action, note: n.note, recordedBy: n.recorded_by, recordedAt: n.recorded_at.toISOString() })),
    runs,
    auditEvents,
  };
}
