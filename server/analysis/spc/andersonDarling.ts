import { mean, sampleStdDev } from './descriptive.js';
import { logNormalCdf } from './normal.js';
import { requireFiniteArray } from './validate.js';

export interface AndersonDarlingResult {
  /** A², with mean and standard deviation estimated from the sample */
  andersonDarling: number;
  /** A*² = A²·(1 + 0.75/n + 2.25/n²), the small-sample modification the p-value uses */
  andersonDarlingAdjusted: number;
  pValue: number;
}

/**
 * p-value of the modified statistic for the normal case with both parameters estimated:
 * D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, Table 4.9. The last branch is a
 * parabola with its vertex at A*² = 5.709/(2·0.0186) ≈ 153.5; past the vertex it would rise
 * again, so 0 is returned there (the true p-value is far below double precision long before).
 */
export function andersonDarlingPValue(adjusted: number): number {
  const a = adjusted;
  let p: number;
  if (a < 0.2) p = 1 - Math.exp(-13.436 + 101.14 * a - 223.73 * a * a);
  else if (a < 0.34) p = 1 - Math.exp(-8.318 + 42.796 * a - 59.938 * a * a);
  else if (a < 0.6) p = Math.exp(0.9177 - 4.279 * a - 1.38 * a * a);
  else if (a < 5.709 / (2 * 0.0186)) p = Math.exp(1.2937 - 5.709 * a + 0.0186 * a * a);
  else p = 0;
  return Math.min(1, Math.max(0, p));
}

/**
 * Anderson–Darling test of normality with estimated mean and standard deviation (Anderson &
 * Darling 1954; Stephens 1974; D'Agostino & Stephens 1986, ch. 4): with zᵢ the standardised order
 * statistics, A² = −n − (1/n)·Σ(2i − 1)[ln Φ(zᵢ) + ln(1 − Φ(z₍ₙ₊₁₋ᵢ₎))], then A*² and the
 * Table 4.9 p-value. ln(1 − Φ(z)) is taken as ln Φ(−z) so outliers do not produce log(0).
 */
export function andersonDarlingNormality(values: readonly number[]): AndersonDarlingResult {
  requireFiniteArray('values', values, 3);
  const n = values.length;
  const m = mean(values);
  const s = sampleStdDev(values);
  if (s === 0) throw new Error('values must not all be equal: the normality test needs some spread');
  const z = [...values].sort((a, b) => a - b).map((x) => (x - m) / s);
  let sum = 0;
  for (let i = 0; i < n; i++) sum += (2 * i + 1) * (logNormalCdf(z[i]) + logNormalCdf(-z[n - 1 - i]));
  const aSquared = -n - sum / n;
  const adjusted = aSquared * (1 + 0.75 / n + 2.25 / (n * n));
  return { andersonDarling: aSquared, andersonDarlingAdjusted: adjusted, pValue: andersonDarlingPValue(adjusted) };
}
