/**
 * Argument checks shared by the SPC functions. Every message names the argument and the reason, so
 * a caller (or an API error body) can tell exactly which input was wrong.
 */

/** An array of at least minLength finite numbers. */
export function requireFiniteArray(name: string, values: readonly number[], minLength: number): void {
  if (!Array.isArray(values)) throw new Error(`${name} must be an array of numbers`);
  if (values.length < minLength) {
    throw new Error(`${name} must hold at least ${minLength} value(s), got ${values.length}`);
  }
  for (let i = 0; i < values.length; i++) {
    if (typeof values[i] !== 'number' || !Number.isFinite(values[i])) {
      throw new Error(`${name}[${i}] must be a finite number, got ${String(values[i])}`);
    }
  }
}

/** A finite number (not NaN, not ±Infinity). */
export function requireFinite(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(`${name} must be a finite number, got ${String(value)}`);
  }
}

/** A finite number greater than zero. */
export function requirePositive(name: string, value: number): void {
  requireFinite(name, value);
  if (value <= 0) throw new Error(`${name} must be greater than 0, got ${value}`);
}

/** An integer from min to max inclusive. */
export function requireIntegerInRange(name: string, value: number, min: number, max: number): void {
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new Error(`${name} must be an integer from ${min} to ${max}, got ${String(value)}`);
  }
}
