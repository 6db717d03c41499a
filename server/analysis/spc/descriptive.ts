import { controlChartConstants } from './constants.js';

/** Small sample statistics shared by the charts and the capability study. */

/** Arithmetic mean. */
export function mean(values: readonly number[]): number {
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

/** Sample standard deviation with the n − 1 divisor; two-pass for numerical stability. */
export function sampleStdDev(values: readonly number[]): number {
  const m = mean(values);
  let squares = 0;
  for (const v of values) squares += (v - m) ** 2;
  return Math.sqrt(squares / (values.length - 1));
}

/** MR̄, the average moving range of span 2: mean of |xᵢ − xᵢ₋₁| (NIST/SEMATECH §6.3.2.2). */
export function averageMovingRange(values: readonly number[]): number {
  let sum = 0;
  for (let i = 1; i < values.length; i++) sum += Math.abs(values[i] - values[i - 1]);
  return sum / (values.length - 1);
}

/** σ̂ = MR̄/d₂(2), the short-term sigma of individual values (NIST/SEMATECH §6.3.2.2). */
export function sigmaFromMovingRange(values: readonly number[]): number {
  return averageMovingRange(values) / controlChartConstants(2).d2;
}

/** Subgroup range R = max − min (NIST/SEMATECH §6.3.2.1). */
export function range(values: readonly number[]): number {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return max - min;
}
