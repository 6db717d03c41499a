import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { conflict, notFound } from '../../errors.js';
import type { CharacteristicCreateInput, CharacteristicUpdateInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, reasonOf } from './actor.js';
import { findProductRow } from './product-rows.js';
import { changeReferenceData } from './change-reference-data.js';

export type CharacteristicRow = {
  id: number; product_id: number; code: string; name: string; unit: string; test_step: string;
  spc_enabled: number | boolean; subgroup_mode: string; subgroup_size: number | null;
  derived: number | boolean; sort_order: number;
};

export type Characteristic = ReturnType<typeof toCharacteristic>;

export function toCharacteristic(row: CharacteristicRow) {
  return {
    code: row.code,
    name: row.name,
    unit: row.unit,
    testStep: row.test_step,
    spcEnabled: Boolean(row.spc_enabled),
    subgroupMode: row.subgroup_mode,
    subgroupSize: row.subgroup_size,
    derived: Boolean(row.derived),
    sortOrder: row.sort_order,
  };
}

function columns(input: CharacteristicUpdateInput) {
  return {
    name: input.name, unit: input.unit, test_step: input.testStep, spc_enabled: input.spcEnabled,
    subgroup_mode: input.subgroupMode, subgroup_size: input.subgroupSize, sort_order: input.sortOrder,
  };
}

/** A product's characteristic rows in test order. */
export async function characteristicRowsOf(db: Knex, productId: number): Promise<CharacteristicRow[]> {
  return db<CharacteristicRow>('characteristics').where({ product_id: productId }).orderBy([{ column: 'sort_order' }, { column: 'code' }]);
}

export async function listCharacteristics(db: Knex, productCode: string) {
  const product = await findProductRow(db, productCode);
  return (await characteristicRowsOf(db, product.id)).map(toCharacteristic);
}

async function findCharacteristicRow(db: Knex, productId: number, code: string, productCode: string) {
  const row = await db<CharacteristicRow>('characteristics').where({ product_id: productId, code }).first();
  if (!row) throw notFound(`Product ${productCode} has no characteristic ${code}.`);
  return row;
}

export async function createCharacteristic(db: Knex, user: SessionUser, productCode: string, input: CharacteristicCreateInput, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    const product = await findProductRow(trx, productCode, { lock: true });
    const taken = await trx('characteristics').where({ product_id: product.id, code: input.code }).first();
    if (taken) throw conflict(`Product ${productCode} already has a characteristic ${input.code}.`, [{ field: 'code', message: 'Already in use' }]);
    await trx('characteristics').insert({ product_id: product.id, code: input.code, ...columns(input) });
    const characteristic = toCharacteristic(await findCharacteristicRow(trx, product.id, input.code, productCode));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'characteristic.created', entityType: 'characteristic',
      entityId: `${productCode}/${input.code}`, after: characteristic, reason: reasonOf(input.reason), at: now,
    });
    return characteristic;
  });
}

export async function updateCharacteristic(
  db: Knex, user: SessionUser, productCode: string, code: string, input: CharacteristicUpdateInput, now = new Date(),
) {
  return changeReferenceData(db, async (trx) => {
    const product = await findProductRow(trx, productCode, { lock: true });
    const before = toCharacteristic(await findCharacteristicRow(trx, product.id, code, productCode));
    await trx('characteristics').where({ product_id: product.id, code }).update(columns(input));
    const after = toCharacteristic(await findCharacteristicRow(trx, product.id, code, productCode));
    await recordAudit(trx, {
      actor: actorOf(user), action: 'characteristic.updated', entityType: 'characteristic',
      entityId: `${productCode}/${code}`, before, after, reason: reasonOf(input.reason), at: now,
    });
    return after;
  });
}
