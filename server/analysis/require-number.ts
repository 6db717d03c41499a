/**
 * Scalar argument checks shared by the analyses. Each throws an Error whose message names the
 * argument and the reason, so a bad test record points at its own field.
 */

export function requireFinite(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(`${name} must be a finite number, got ${String(value)}`);
  }
  return value;
}

export function requireNonNegative(name: string, value: number): number {
  requireFinite(name, value);
  if (value < 0) throw new Error(`${name} must not be negative, got ${value}`);
  return value;
}

export function requirePositive(name: string, value: number): number {
  requireFinite(name, value);
  if (value <= 0) throw new Error(`${name} must be greater than zero, got ${value}`);
  return value;
}

export function requirePositiveInteger(name: string, value: number): number {
  requirePositive(name, value);
  if (!Number.isInteger(value)) throw new Error(`${name} must be a whole number, got ${value}`);
  return value;
}
