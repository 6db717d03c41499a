/**
 * Argument checks shared by the electrical computations. Each throws an Error whose message names
 * the argument and the reason, so a bad test record points at its own field.
 */

import { requireFinite } from '../require-number.js';

export { requireFinite, requireNonNegative, requirePositive, requirePositiveInteger } from '../require-number.js';

/** Winding temperatures outside this span are sensor faults, not test conditions (common practice). */
export const MIN_TEMPERATURE_C = -40;
export const MAX_TEMPERATURE_C = 200;

export function requireTemperatureC(name: string, value: number): number {
  requireFinite(name, value);
  if (value < MIN_TEMPERATURE_C || value > MAX_TEMPERATURE_C) {
    throw new Error(
      `${name} must be between ${MIN_TEMPERATURE_C} and ${MAX_TEMPERATURE_C} °C, got ${value}`,
    );
  }
  return value;
}

export function requireOneOf<T extends string>(name: string, value: T, allowed: readonly T[]): T {
  if (!allowed.includes(value)) {
    throw new Error(`${name} must be one of ${allowed.join(', ')}, got ${String(value)}`);
  }
  return value;
}
