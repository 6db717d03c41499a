import { z } from 'zod';
import type { Knex } from 'knex';
import { invalid, type FieldError } from '../../errors.js';

const serial = z.string().trim().min(1, 'a serial may not be empty').max(64, 'a serial has at most 64 characters');
const instant = z.iso.datetime({ offset: true }).or(z.iso.date());

/**
 * What an evidence pack covers. Criteria combine with AND; at least one is required so nobody
 * exports the whole plant by leaving the form empty. `to` is exclusive.
 */
export const packFilterSchema = z.object({
  serials: z.array(serial).min(1, 'give at least one serial or leave the list out').max(40_000, 'at most 40,000 serials per pack (split a longer list into several packs)').optional(),
  serialFrom: serial.optional(),
  serialTo: serial.optional(),
  lots: z.array(z.string().trim().min(1).max(64)).min(1).max(500, 'at most 500 lots per pack').optional(),
  product: z.string().trim().min(1).max(32).optional(),
  from: instant.optional(),
  to: instant.optional(),
}).strict()
  .refine((f) => (f.serialFrom === undefined) === (f.serialTo === undefined), { path: ['serialTo'], message: 'a serial range needs both serialFrom and serialTo' })
  .refine((f) => !f.serialFrom || !f.serialTo || f.serialFrom <= f.serialTo, { path: ['serialTo'], message: 'serialTo must not sort before serialFrom' })
  .refine((f) => !f.from || !f.to || new Date(f.from) < new Date(f.to), { path: ['to'], message: 'to must be after from' })
  .refine((f) => f.serials || f.serialFrom || f.lots || f.product || f.from || f.to, {
    path: ['(body)'], message: 'choose at least one of serials, serialFrom/serialTo, lots, product, from, to',
  });

export type PackFilter = z.infer<typeof packFilterSchema>;

/** Duplicates in a pasted list are harmless; dropping them keeps the stored filter small. */
export function normaliseFilter(filter: PackFilter): PackFilter {
  return {
    ...filter,
    ...(filter.serials ? { serials: [...new Set(filter.serials)] } : {}),
    ...(filter.lots ? { lots: [...new Set(filter.lots)] } : {}),
  };
}

/** Named lots and the product must exist; a typo should fail now, not yield an empty pack later. */
export async function checkFilterReferences(db: Knex, filter: PackFilter): Promise<void> {
  const problems: FieldError[] = [];
  if (filter.product && !(await db('products').where({ code: filter.product }).first('id'))) {
    problems.push({ field: 'product', message: `no product with code ${filter.product}` });
  }
  if (filter.lots) {
    const known = new Set((await db('lots').whereIn('code', filter.lots).pluck('code')) as string[]);
    filter.lots.forEach((code, index) => {
      if (!known.has(code)) problems.push({ field: `lots[${index}]`, message: `no lot with code ${code}` });
    });
  }
  if (problems.length > 0) throw invalid(problems, 'The pack names records that do not exist.');
}
