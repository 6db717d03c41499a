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

/** A bound value the driver writes as the given SQL text instead of escaping it (its toSqlString hook). */
export class SqlText {
  constructor(private readonly text: string) {}
  toSqlString(): string { return this.text; }
}

/**
 * A value as JSON text in a quoted SQL string, for a JSON column. JSON.stringify writes no raw
 * control characters, so only backslash and single quote need escaping. The driver's escaping
 * would also escape every double quote, one string piece at a time: for the answer stored with each
 * run, that allocated more than the rest of the run's write.
 */
export function jsonValue(value: unknown): SqlText {
  const json = JSON.stringify(value) as string | undefined;
  if (json === undefined) throw new Error('no JSON text for an undefined value');
  return new SqlText(`'${json.replace(/[\\']/g, '\\$&')}'`);
}
