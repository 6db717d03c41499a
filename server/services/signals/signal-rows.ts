import type { Knex } from 'knex';
import { conflict, notFound } from '../../errors.js';
import { describeSignalRule } from '../spc/describe-signal-rule.js';
import type { SignalRule } from '../spc/chart-kinds.js';

export type SignalStatus = 'open' | 'acknowledged' | 'contained' | 'closed';

export type SignalRow = {
  id: number; characteristic_id: number; product_id: number; control_limit_id: number; rule: SignalRule; lot_id: number;
  first_run_id: number | string; pattern_first_run_id: number | string; status: SignalStatus;
  assignee_subject: string | null; assignee_name: string | null; cause: string | null; action_taken: string | null;
  outcome: 'released' | 'scrapped' | 'reworked' | null; opened_at: Date;
  acknowledged_by: string | null; acknowledged_at: Date | null; contained_by: string | null; contained_at: Date | null;
  closed_by: string | null; closed_at: Date | null;
  product_code: string; characteristic_code: string; characteristic_name: string; unit: string; lot_code: string;
};

/** Signals with the names people read: product, characteristic and the lot the episode began in. */
export function signalsQuery(db: Knex): Knex.QueryBuilder {
  return db('signals')
    .join('products', 'products.id', 'signals.product_id')
    .join('characteristics', 'characteristics.id', 'signals.characteristic_id')
    .join('lots', 'lots.id', 'signals.lot_id')
    .select('signals.*', 'products.code as product_code', 'characteristics.code as characteristic_code',
      'characteristics.name as characteristic_name', 'characteristics.unit', 'lots.code as lot_code');
}

const iso = (value: Date | null) => (value ? value.toISOString() : null);

export function toSignalSummary(row: SignalRow) {
  return {
    id: row.id, status: row.status, rule: row.rule, ruleText: describeSignalRule(row.rule),
    product: row.product_code, characteristicId: row.characteristic_id, characteristic: row.characteristic_code,
    characteristicName: row.characteristic_name, unit: row.unit, lot: row.lot_code,
    firstRunId: Number(row.first_run_id), patternFirstRunId: Number(row.pattern_first_run_id),
    assignee: row.assignee_subject ? { subject: row.assignee_subject, name: row.assignee_name } : null,
    openedAt: row.opened_at.toISOString(),
    acknowledged: row.acknowledged_at ? { by: row.acknowledged_by, at: iso(row.acknowledged_at) } : null,
    contained: row.contained_at ? { by: row.contained_by, at: iso(row.contained_at) } : null,
    closed: row.closed_at ? { by: row.closed_by, at: iso(row.closed_at), cause: row.cause, actionTaken: row.action_taken, outcome: row.outcome } : null,
  };
}
export type SignalSummary = ReturnType<typeof toSignalSummary>;

/** The signal row, locked for a change; the states it may be in for that change are checked here. */
export async function lockSignal(trx: Knex.Transaction, id: number, allowed: readonly SignalStatus[], action: string): Promise<SignalRow> {
  const locked = await trx('signals').where({ id }).forUpdate().first('id');
  if (!locked) throw notFound(`No signal ${id}.`);
  const row: SignalRow = await signalsQuery(trx).where('signals.id', id).first();
  if (!allowed.includes(row.status)) throw conflict(`Signal ${id} is ${row.status}; it cannot be ${action} now.`);
  return row;
}

export async function findSignal(db: Knex, id: number): Promise<SignalRow> {
  const row: SignalRow | undefined = await signalsQuery(db).where('signals.id', id).first();
  if (!row) throw notFound(`No signal ${id}.`);
  return row;
}
