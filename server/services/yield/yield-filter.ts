import type { Knex } from 'knex';
import { z } from 'zod';
import { invalid, type FieldError } from '../../errors.js';
import { addDays } from './plant-time.js';
import { slotOf, type ShiftCalendar } from './shift-calendar.js';

export const yieldGroupings = ['day', 'week', 'shift', 'line', 'station', 'product', 'lot'] as const;
export type YieldGrouping = (typeof yieldGroupings)[number];

const plantDate = z.iso.date({ error: 'must be a plant date YYYY-MM-DD' });
const code = z.string().trim().min(1).max(64);

/** The board's filter, shared by the yield, headline and drill-down endpoints. */
export const yieldFilterFields = {
  from: plantDate.optional().describe('first production day, inclusive; 29 days before `to` when omitted'),
  to: plantDate.optional().describe('last production day, inclusive; today when omitted'),
  product: code.optional(),
  line: code.optional(),
  station: code.optional(),
  lot: code.optional(),
};

export const yieldQuerySchema = z.strictObject({
  ...yieldFilterFields,
  groupBy: z.enum(yieldGroupings, { error: `must be one of ${yieldGroupings.join(', ')}` }).default('day'),
}).meta({ id: 'YieldQuery' });

export type YieldFilterInput = { from?: string; to?: string; product?: string; line?: string; station?: string; lot?: string };

/** A filter resolved to the rollups' ids and production days (and a shift, for a drill-down). */
export type ResolvedFilter = {
  fromDay: string; toDay: string; shift?: string;
  productId?: number; line?: string; stationId?: number; lotId?: number;
};

const maxDays = 400;

export async function resolveYieldFilter(db: Knex, calendar: ShiftCalendar, input: YieldFilterInput, now: Date): Promise<ResolvedFilter> {
  const toDay = input.to ?? slotOf(calendar, now).day;
  const fromDay = input.from ?? addDays(toDay, -29);
  const fields: FieldError[] = [];
  if (fromDay > toDay) fields.push({ field: 'from', message: 'must not be after to' });
  else if (Date.parse(toDay) - Date.parse(fromDay) > maxDays * 86_400_000) fields.push({ field: 'from', message: `the range may span at most ${maxDays} days` });
  const [product, station, lot] = await Promise.all([
    input.product ? db('products').where({ code: input.product }).first('id') : undefined,
    input.station ? db('stations').where({ code: input.station }).first('id') : undefined,
    input.lot ? db('lots').where({ code: input.lot }).first('id') : undefined,
  ]);
  if (input.product && !product) fields.push({ field: 'product', message: `product ${input.product} is not known` });
  if (input.station && !station) fields.push({ field: 'station', message: `station ${input.station} is not known` });
  if (input.lot && !lot) fields.push({ field: 'lot', message: `lot ${input.lot} is not known` });
  if (fields.length > 0) throw invalid(fields);
  return {
    fromDay, toDay,
    productId: product?.id, line: input.line, stationId: station?.id, lotId: lot?.id,
  };
}

/** Applies a resolved filter to a query over a rollup table aliased `alias`. */
export function whereFilter<Q extends Knex.QueryBuilder>(query: Q, filter: ResolvedFilter, alias: string): Q {
  query.whereBetween(`${alias}.shift_day`, [filter.fromDay, filter.toDay]);
  if (filter.shift !== undefined) query.where(`${alias}.shift_code`, filter.shift);
  if (filter.productId !== undefined) query.where(`${alias}.product_id`, filter.productId);
  if (filter.line !== undefined) query.where(`${alias}.line`, filter.line);
  if (filter.stationId !== undefined) query.where(`${alias}.station_id`, filter.stationId);
  if (filter.lotId !== undefined) query.where(`${alias}.lot_id`, filter.lotId);
  return query;
}
