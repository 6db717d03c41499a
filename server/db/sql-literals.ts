/**
 * SQL text for values the app itself produced, written straight into a statement where binding
 * them would cost more than running it: the driver's placeholder formatting scans the whole
 * statement and escapes each value, and a batch's measurements carry thousands of them.
 */

/** A finite number, or NULL: the same text as the driver's escaping writes (`value + ''`). */
export function numberLiteral(value: number | null): string {
  if (value === null) return 'NULL';
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new Error(`not a finite number: ${String(value)}`);
  return `${value}`;
}

/** One of a fixed set of words (an ENUM's values), quoted. */
export function wordLiteral<T extends string>(value: T, allowed: readonly T[]): string {
  if (!allowed.includes(value) || !/^[a-z_ ]+$/.test(value)) throw new Error(`not one of ${allowed.join(', ')}: ${value}`);
  return `'${value}'`;
}
