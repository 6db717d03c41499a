import type { FieldError } from '../../errors.js';
import type { TestRunDocument } from '../../schemas/test-run.js';
import type { LotRef, ProductRef } from './reference-data.js';

/** Stand clocks drift; a run may appear to start up to this far in our future. */
export const clockSkewMs = 2 * 60 * 1000;

/** Start before finish, neither in the future (beyond the allowed clock skew). */
export function checkTimes(document: TestRunDocument, now: Date): FieldError[] {
  const fields: FieldError[] = [];
  const latestMs = now.getTime() + clockSkewMs;
  const startedMs = Date.parse(document.startedAt);
  const finishedMs = Date.parse(document.finishedAt);
  if (startedMs > latestMs) fields.push({ field: 'startedAt', message: 'is in the future (more than 2 minutes ahead of the server clock)' });
  if (finishedMs > latestMs) fields.push({ field: 'finishedAt', message: 'is in the future (more than 2 minutes ahead of the server clock)' });
  if (finishedMs < startedMs) fields.push({ field: 'finishedAt', message: 'is before startedAt' });
  return fields;
}

/** The serial must fit the product's pattern, and the lot must exist and belong to the product. */
export function checkSerialAndLot(document: TestRunDocument, product: ProductRef, lot: LotRef | null): FieldError[] {
  const fields: FieldError[] = [];
  if (!product.serialPattern.test(document.serial)) {
    fields.push({ field: 'serial', message: `does not match the serial pattern of product ${product.code}` });
  }
  if (!lot) fields.push({ field: 'lot', message: `lot ${document.lot} is not known; lots are created before their motors are tested` });
  else if (lot.productId !== product.id) fields.push({ field: 'lot', message: `lot ${document.lot} is a lot of another product, not ${product.code}` });
  return fields;
}
