import type { Knex } from 'knex';
import { characteristicRowsOf } from './characteristics.js';
import { findLimitSetInForce, findLimitSetRow, limitsOf, type LimitValues } from './limit-set-rows.js';

type Bounds = Omit<LimitValues, 'characteristicCode'>;
export type LimitChange = 'added' | 'removed' | 'changed' | 'unchanged';

function boundsOf(limit: LimitValues | undefined): Bounds | null {
  return limit ? { lsl: limit.lsl, nominal: limit.nominal, usl: limit.usl } : null;
}

function changeOf(before: Bounds | null, after: Bounds | null): LimitChange {
  if (!before && !after) return 'unchanged';
  if (!before) return 'added';
  if (!after) return 'removed';
  const same = before.lsl === after.lsl && before.nominal === after.nominal && before.usl === after.usl;
  return same ? 'unchanged' : 'changed';
}

/**
 * Per characteristic of the product, before and after. A draft is compared with the revision in
 * force now (what approval would change); an approved or retired revision with the one that was
 * in force when it took effect (what it changed).
 */
export async function limitSetDifference(db: Knex, id: number, now = new Date()) {
  const row = await findLimitSetRow(db, id);
  const at = row.status === 'draft' || !row.effective_from ? now : row.effective_from;
  const inForce = await findLimitSetInForce(db, row.product_id, at, { excludeId: id });
  const beforeLimits = inForce ? await limitsOf(db, inForce.id) : [];
  const afterLimits = await limitsOf(db, id);
  const characteristics = await characteristicRowsOf(db, row.product_id);
  const rows = characteristics.map((characteristic) => {
    const before = boundsOf(beforeLimits.find((l) => l.characteristicCode === characteristic.code));
    const after = boundsOf(afterLimits.find((l) => l.characteristicCode === characteristic.code));
    return { characteristicCode: characteristic.code, name: characteristic.name, unit: characteristic.unit, before, after, change: changeOf(before, after) };
  });
  return {
    limitSetId: id,
    revision: row.revision,
    status: row.status,
    comparedWithRevision: inForce?.revision ?? null,
    rows,
    changedCount: rows.filter((r) => r.change !== 'unchanged').length,
  };
}
