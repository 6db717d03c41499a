import { mean, sigmaFromMovingRange } from './descriptive.js';
import { requireFinite, requireFiniteArray, requirePositive } from './validate.js';

export interface CusumOptions {
  /** reference value in σ units: K = k·σ (commonly 0.5, half the shift to detect) */
  k: number;
  /** decision interval in σ units: H = h·σ (commonly 4 or 5) */
  h: number;
  /** μ₀; default the mean of the values */
  target?: number;
  /** σ of one value; default MR̄/d₂(2). Pass sigma = 1 to give k and h in data units. */
  sigma?: number;
}

export interface CusumSignal {
  index: number;
  side: 'upper' | 'lower';
}

export interface CusumChart {
  target: number;
  sigma: number;
  /** C⁺ᵢ (Montgomery & Runger's S_H) for each value */
  upper: number[];
  /** C⁻ᵢ (S_L), reported as a non-negative sum */
  lower: number[];
  /** every index where a sum exceeds H, in order */
  signals: CusumSignal[];
}

/**
 * Tabular (two-sided) CUSUM (Page 1954; Montgomery & Runger, Applied Statistics and Probability
 * for Engineers, Example 16-6; NIST/SEMATECH e-Handbook §6.3.2.3): C⁺ᵢ = max(0, xᵢ − (μ₀ + K) + C⁺ᵢ₋₁),
 * C⁻ᵢ = max(0, (μ₀ − K) − xᵢ + C⁻ᵢ₋₁), starting at 0; a signal when a sum exceeds H (strictly).
 * k and h are in σ units (K = kσ, H = hσ). The sums are not reset after a signal: finding and
 * removing the cause is the operator's step, and the run of signals shows how long the shift
 * lasted (common practice).
 */
export function cusumChart(values: readonly number[], options: CusumOptions): CusumChart {
  requireFinite('options.k', options.k);
  if (options.k < 0) throw new Error(`options.k must not be negative, got ${options.k}`);
  requirePositive('options.h', options.h);
  if (options.target !== undefined) requireFinite('options.target', options.target);
  if (options.sigma !== undefined) requirePositive('options.sigma', options.sigma);
  requireFiniteArray('values', values, options.sigma === undefined ? 2 : 1);

  const target = options.target ?? mean(values);
  const sigma = options.sigma ?? sigmaFromMovingRange(values);
  const K = options.k * sigma;
  const H = options.h * sigma;

  const upper: number[] = [];
  const lower: number[] = [];
  const signals: CusumSignal[] = [];
  let high = 0;
  let low = 0;
  values.forEach((x, index) => {
    high = Math.max(0, x - (target + K) + high);
    low = Math.max(0, target - K - x + low);
    upper.push(high);
    lower.push(low);
    if (high > H) signals.push({ index, side: 'upper' });
    if (low > H) signals.push({ index, side: 'lower' });
  });
  return { target, sigma, upper, lower, signals };
}
