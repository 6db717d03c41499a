import type { Knex } from 'knex';

export type WhereUsedLot = {
  code: string; product: string; componentKind: string; supplier: string | null;
  motorCount: number; onHold: boolean;
};
export type WhereUsedMotor = { serial: string; lot: string; product: string; status: string; onHold: boolean };
export type WhereUsed = { componentLot: string; lots: WhereUsedLot[]; motors: WhereUsedMotor[]; motorsTruncated: boolean };

/** A recall list can be long, but a browser table of more than this is no longer read; the evidence pack has all. */
export const whereUsedMotorLimit = 5000;

type LotRow = { id: number; code: string; product: string; component_kind: string; supplier: string | null; motor_count: number };
type MotorRow = { id: number; serial: string; lot: string; lot_id: number; product: string; status: string };

/**
 * Where-used for a recall: every Fluxtrail lot built with the supplier's component lot, and every
 * motor in those lots with its status and whether a hold (on the motor or its lot) is still open.
 */
export async function findWhereUsed(db: Knex, supplierLotCode: string): Promise<WhereUsed> {
  const lots = (await db({ lc: 'lot_components' })
    .join({ l: 'lots' }, 'l.id', 'lc.lot_id')
    .join({ p: 'products' }, 'p.id', 'l.product_id')
    .where('lc.supplier_lot_code', supplierLotCode)
    .orderBy('l.code')
    .select('l.id', 'l.code', { product: 'p.code' }, 'lc.component_kind', 'lc.supplier',
      db('motors').count('*').whereRaw('motors.lot_id = l.id').as('motor_count'))) as LotRow[];
  const lotIds = [...new Set(lots.map((l) => Number(l.id)))];
  if (lotIds.length === 0) return { componentLot: supplierLotCode, lots: [], motors: [], motorsTruncated: false };

  const motors = (await db({ m: 'motors' }).join({ l: 'lots' }, 'l.id', 'm.lot_id').join({ p: 'products' }, 'p.id', 'm.product_id')
    .whereIn('m.lot_id', lotIds).orderBy('m.serial').limit(whereUsedMotorLimit + 1)
    .select('m.id', 'm.serial', { lot: 'l.code' }, 'm.lot_id', { product: 'p.code' }, 'm.status')) as MotorRow[];
  const shown = motors.slice(0, whereUsedMotorLimit);
  const holds = (await db('holds').whereNull('released_at')
    .where((q) => q.whereIn('lot_id', lotIds).orWhereIn('motor_id', shown.map((m) => Number(m.id))))
    .select('motor_id', 'lot_id')) as Array<{ motor_id: number | null; lot_id: number | null }>;
  const heldLots = new Set(holds.filter((h) => h.lot_id !== null).map((h) => Number(h.lot_id)));
  const heldMotors = new Set(holds.filter((h) => h.motor_id !== null).map((h) => Number(h.motor_id)));

  return {
    componentLot: supplierLotCode,
    lots: lots.map((l) => ({
      code: l.code, product: l.product, componentKind: l.component_kind, supplier: l.supplier,
      motorCount: Number(l.motor_count), onHold: heldLots.has(Number(l.id)),
    })),
    motors: shown.map((m) => ({
      serial: m.serial, lot: m.lot, product: m.product, status: m.status,
      onHold: m.status === 'on hold' || heldMotors.has(Number(m.id)) || heldLots.has(Number(m.lot_id)),
    })),
    motorsTruncated: motors.length > whereUsedMotorLimit,
  };
}
