import { mean, sigmaFromMovingRange } from './descriptive.js';
import { requireFinite, requireFiniteArray, requirePositive } from './validate.js';

export interface EwmaOptions {
  /** smoothing weight λ, 0 < λ ≤ 1 (λ = 1 is the Shewhart individuals chart) */
  lambda: number;
  /** limit width in standard deviations of z (NIST's k; commonly 3) */
  L: number;
  /** centre line and z₀; default the mean of the values */
  target?: number;
  /** process standard deviation of one value; default MR̄/d₂(2) from the values */
  sigma?: number;
}

export interface EwmaPoint {
  /** position in the input, from 0; the limit formula uses t = index + 1 */
  index: number;
  value: number;
  z: number;
  ucl: number;
  lcl: number;
  /** z strictly outside its time-varying limits */
  outOfControl: boolean;
}

export interface EwmaChart {
  target: number;
  sigma: number;
  points: EwmaPoint[];
  asymptoticUcl: number;
  asymptoticLcl: number;
}

/**
 * EWMA chart (Roberts 1959; NIST/SEMATECH e-Handbook §6.3.2.4; Lucas & Saccucci 1990):
 * zₜ = λxₜ + (1 − λ)zₜ₋₁ with z₀ = target, limits target ± L·σ·√(λ/(2 − λ)·(1 − (1 − λ)^{2t})),
 * which widen towards the asymptotic target ± L·σ·√(λ/(2 − λ)).
 */
export function ewmaChart(values: readonly number[], options: EwmaOptions): EwmaChart {
  const { lambda, L } = options;
  requireFinite('options.lambda', lambda);
  if (lambda <= 0 || lambda > 1) throw new Error(`options.lambda must be in (0, 1], got ${lambda}`);
  requirePositive('options.L', L);
  if (options.target !== undefined) requireFinite('options.target', options.target);
  if (options.sigma !== undefined) requirePositive('options.sigma', options.sigma);
  // Without a given sigma the moving range needs two values; with one, a single value is a chart.
  requireFiniteArray('values', values, options.sigma === undefined ? 2 : 1);

  const target = options.target ?? mean(values);
  const sigma = options.sigma ?? sigmaFromMovingRange(values);
  const asymptoticHalfWidth = L * sigma * Math.sqrt(lambda / (2 - lambda));

  const points: EwmaPoint[] = [];
  let z = target;
  let decay = 1; // (1 − λ)^{2t}, updated multiplicatively
  values.forEach((value, index) => {
    z = lambda * value + (1 - lambda) * z;
    decay *= (1 - lambda) * (1 - lambda);
    const halfWidth = asymptoticHalfWidth * Math.sqrt(1 - decay);
    const ucl = target + halfWidth;
    const lcl = target - halfWidth;
    points.push({ index, value, z, ucl, lcl, outOfControl: z > ucl || z < lcl });
  });

  return {
    target,
    sigma,
    points,
    asymptoticUcl: target + asymptoticHalfWidth,
    asymptoticLcl: target - asymptoticHalfWidth,
  };
}
