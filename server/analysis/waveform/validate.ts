/**
 * Argument checks for the waveform analyses. Each throws an Error whose message names the
 * argument and the reason, so a bad test record points at its own field.
 */

/** Samples as a test stand sends them: a plain array or a typed array of volts or degrees. */
export type Samples = readonly number[] | Float64Array;

export { requirePositive, requirePositiveInteger } from '../require-number.js';

/**
 * Samples as a Float64Array after checking that every one is a finite number. A Float64Array is
 * used as it is (the analyses only read it); a plain array is copied.
 */
export function toFiniteSamples(name: string, values: Samples): Float64Array {
  if (values instanceof Float64Array) {
    for (let i = 0; i < values.length; i++) {
      if (!Number.isFinite(values[i])) throw notFinite(name, i, values[i]);
    }
    return values;
  }
  if (!Array.isArray(values)) throw new Error(`${name} must be an array of numbers`);
  for (let i = 0; i < values.length; i++) {
    // Checked on the original because a typed-array copy would turn null into 0.
    if (typeof values[i] !== 'number' || !Number.isFinite(values[i])) throw notFinite(name, i, values[i]);
  }
  return new Float64Array(values);
}

function notFinite(name: string, index: number, value: unknown): Error {
  return new Error(`${name}[${index}] must be a finite number, got ${String(value)}`);
}

/** Requires every named record to hold the same number of samples as the first. */
export function requireSameLength(records: ReadonlyArray<readonly [string, { length: number }]>): void {
  const [firstName, first] = records[0];
  for (const [name, record] of records) {
    if (record.length !== first.length) {
      throw new Error(
        `${name} must hold as many samples as ${firstName} (${first.length}), got ${record.length}`,
      );
    }
  }
}
