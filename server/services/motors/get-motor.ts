import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import { componentsOfLotQuery, toComponentView, type ComponentRow, type LotComponentView } from '../lots/lot-components.js';
import { holdsQuery, toHoldView, type HoldRow, type HoldView } from '../holds/hold-view.js';
import { runsOfMotorStatements, runViews, type ReadingRow, type ResultRow, type RunRow, type RunView, type WaveformRow } from './motor-runs.js';
import { auditEventsOfOneStatement, auditEventViews, type AuditRow, type AuditEventView } from './entity-audit-events.js';
import { statementPool } from '../../db/knex.js';
import { runStatements, type Statement } from '../../db/statements.js';
import { StatementTemplates } from '../../db/statement-templates.js';
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

type MotorRow = {
  id: number; serial: string; status: MotorStatus; lot_code: string; product_code: string; product_name: string; motor_kind: string;
};
type NoteRow = { id: number; action: 'rework' | 'retest'; note: string; recorded_by: string; recorded_at: Date };

/** The eleven reads of a motor's record, each naming the motor by its serial (value 0). */
function motorRecordReads(reader: Knex, serial: string): Statement[] {
  const ofMotor = (column: 'id' | 'lot_id') => reader('motors').where({ serial }).select(column);
  const lotCode = reader('motors').join('lots', 'lots.id', 'motors.lot_id').where('motors.serial', serial).select('lots.code');
  return [
    reader('motors').join('products', 'products.id', 'motors.product_id').join('lots', 'lots.id', 'motors.lot_id')
      .where('motors.serial', serial)
      .select('motors.id', 'motors.serial', 'motors.status', 'lots.code as lot_code',
        'products.code as product_code', 'products.name as product_name', 'products.motor_kind').toSQL(),
    componentsOfLotQuery(reader, ofMotor('lot_id')).toSQL(),
    // Two reads, not one with OR, so each uses its index.
    holdsQuery(reader).where('holds.motor_id', ofMotor('id')).toSQL(),
    holdsQuery(reader).where('holds.lot_id', ofMotor('lot_id')).toSQL(),
    reader('rework_notes').where('motor_id', ofMotor('id')).orderBy('id', 'desc').toSQL(),
    ...runsOfMotorStatements(reader, ofMotor('id')),
    auditEventsOfOneStatement(reader, 'motor', serial),
    auditEventsOfOneStatement(reader, 'lot', lotCode),
  ];
}

// Built by knex once, then reused with each serial: building them cost more than running them.
const motorRecordTemplates = new StatementTemplates<'record'>((reader, _shape, value) => motorRecordReads(reader, value(0)));

/**
 * Everything recorded about one serial: product, lot, holds (its own and its lot's), runs, notes,
 * audit. Every read names the motor by its serial (a subquery on the unique serial) so that all of
 * them travel in one round trip on the multi-statement pool: a scan at the line must answer fast
 * while the stands are posting, and on a busy server each round trip waits its turn for the CPU.
 */
export async function getMotor(db: Knex, serial: string): Promise<MotorRecord> {
  const reader = statementPool(db) ?? db;
  const [motors, components, motorHolds, lotHolds, notes, runs, results, waveforms, readings, motorAudit, lotAudit] = await runStatements(
    reader, motorRecordTemplates.statements(reader, 'record', [serial]),
  ) as [MotorRow[], ComponentRow[], HoldRow[], HoldRow[], NoteRow[], RunRow[], ResultRow[], WaveformRow[], ReadingRow[], AuditRow[], AuditRow[]];
  const motor = motors[0];
  if (!motor) throw notFound(`No motor with serial ${serial}.`);
  return {
    serial: motor.serial,
    product: { code: motor.product_code, name: motor.product_name, motorKind: motor.motor_kind },
    lot: { code: motor.lot_code, components: components.map(toComponentView) },
    status: motor.status,
    holds: [...motorHolds, ...lotHolds].sort((a, b) => b.id - a.id).map(toHoldView),
    reworkNotes: notes.map((n) => ({ id: n.id, action: n.action, note: n.note, recordedBy: n.recorded_by, recordedAt: n.recorded_at.toISOString() })),
    runs: runViews(runs, results, waveforms, readings),
    auditEvents: auditEventViews([motorAudit, lotAudit]),
  };
}
