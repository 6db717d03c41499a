import type { Knex } from 'knex';

export type LotComponentView = { kind: string; supplierLotCode: string; supplier: string | null };

/** The component lots (stator, magnet, rotor, resolver) a lot was built from. */
export async function componentsOfLot(db: Knex, lotId: number): Promise<LotComponentView[]> {
  const rows = await db('lot_components').where({ lot_id: lotId }).orderBy(['component_kind', 'supplier_lot_code']);
  return rows.map((r) => ({ kind: r.component_kind, supplierLotCode: r.supplier_lot_code, supplier: r.supplier }));
}
