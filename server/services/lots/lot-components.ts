import type { Knex } from 'knex';

export type LotComponentView = { kind: string; supplierLotCode: string; supplier: string | null };

export type ComponentRow = { component_kind: string; supplier_lot_code: string; supplier: string | null };

/** The component lots (stator, magnet, rotor, resolver) a lot was built from; the lot id may be a subquery. */
export function componentsOfLotQuery(db: Knex, lotId: number | Knex.QueryBuilder): Knex.QueryBuilder {
  return db('lot_components').where('lot_id', lotId).orderBy(['component_kind', 'supplier_lot_code']);
}

export function toComponentView(r: ComponentRow): LotComponentView {
  return { kind: r.component_kind, supplierLotCode: r.supplier_lot_code, supplier: r.supplier };
}

/** The component lots (stator, magnet, rotor, resolver) a lot was built from. */
export async function componentsOfLot(db: Knex, lotId: number): Promise<LotComponentView[]> {
  return (await componentsOfLotQuery(db, lotId)).map(toComponentView);
}
