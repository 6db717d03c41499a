import { requireNonNegative } from './validate.js';

/**
 * Percent unbalance, NEMA MG 1 (§14.36 for voltages, clause from memory; the definition applied to any set of phase
 * quantities): 100 × (largest deviation from the mean) / mean. This is deliberately not
 * (max − min)/mean, which overstates unbalance by up to a factor of two.
 * Used for phase resistances, back-EMF line voltages and no-load currents.
 */
export function unbalancePercent(values: number[]): number {
  if (!Array.isArray(values) || values.length < 2) {
    throw new Error('values must hold at least two phase readings');
  }
  values.forEach((value, i) => requireNonNegative(`values[${i}]`, value));
  const mean = values.reduce((sum, value) => sum + value, 0) / values.length;
  if (mean === 0) throw new Error('values must not all be zero: unbalance is relative to their mean');
  const largestDeviation = Math.max(...values.map((value) => Math.abs(value - mean)));
  return (100 * largestDeviation) / mean;
}
