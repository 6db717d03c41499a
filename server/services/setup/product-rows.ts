import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import type { ProductUpdateInput } from '../../schemas/setup.js';

export type ProductRow = {
  id: number; code: string; name: string; motor_kind: string; pole_pairs: number;
  resolver_pole_pairs: number | null; rated_voltage_v: number; rated_power_kw: number;
  rated_speed_rpm: number; winding_material: string; winding_type: string;
  insulation_class: string; serial_pattern: string; created_at: Date;
};

export type Product = ReturnType<typeof toProduct>;

export function toProduct(row: ProductRow) {
  return {
    code: row.code,
    name: row.name,
    motorKind: row.motor_kind,
    polePairs: row.pole_pairs,
    resolverPolePairs: row.resolver_pole_pairs,
    ratedVoltageV: row.rated_voltage_v,
    ratedPowerKw: row.rated_power_kw,
    ratedSpeedRpm: row.rated_speed_rpm,
    windingMaterial: row.winding_material,
    windingType: row.winding_type,
    insulationClass: row.insulation_class,
    serialPattern: row.serial_pattern,
    createdAt: row.created_at.toISOString(),
  };
}

export function productColumns(input: ProductUpdateInput) {
  return {
    name: input.name,
    motor_kind: input.motorKind,
    pole_pairs: input.polePairs,
    resolver_pole_pairs: input.resolverPolePairs,
    rated_voltage_v: input.ratedVoltageV,
    rated_power_kw: input.ratedPowerKw,
    rated_speed_rpm: input.ratedSpeedRpm,
    winding_material: input.windingMaterial,
    winding_type: input.windingType,
    insulation_class: input.insulationClass,
    serial_pattern: input.serialPattern,
  };
}

/** The product row by its code, optionally locked for the caller's transaction; 404 when unknown. */
export async function findProductRow(db: Knex, code: string, options: { lock?: boolean } = {}): Promise<ProductRow> {
  const query = db<ProductRow>('products').where({ code }).first();
  const row = await (options.lock ? query.forUpdate() : query);
  if (!row) throw notFound(`No product with the code ${code}.`);
  return row;
}
