import { andersonDarlingNormality, type AndersonDarlingResult } from './andersonDarling.js';
import { c4, controlChartConstants, MAX_SUBGROUP_SIZE } from './constants.js';
import { mean, range, sampleStdDev, sigmaFromMovingRange } from './descriptive.js';
import { normalCdf, Z_975 } from './normal.js';
import { requireFinite, requireFiniteArray, requireIntegerInRange } from './validate.js';

export interface CapabilityOptions {
  lsl?: number | null;
  usl?: number | null;
  /** consecutive values per rational subgroup; omitted or 1 means individuals (moving range) */
  subgroupSize?: number;
  /** within-subgroup estimator for subgroupSize ≥ 2: R̄/d₂ (default) or s̄/c₄ */
  withinMethod?: 'range' | 'stdDev';
}

export interface CapabilityStudy {
  n: number;
  mean: number;
  sigmaWithin: number;
  sigmaOverall: number;
  /** null unless both limits are given */
  cp: number | null;
  /** min(Cpu, Cpl) of the sides given */
  cpk: number;
  pp: number | null;
  ppk: number;
  /** Bissell (1990) approximate 95 % confidence bounds on Cpk */
  cpkLower95: number;
  cpkUpper95: number;
  /** expected nonconforming parts per million from the normal model with σ_overall */
  ppmOutOfSpec: number;
  normality: AndersonDarlingResult;
}

/**
 * Bissell (1990, "How reliable is your capability index?", Applied Statistics 39(3)) approximate
 * two-sided 95 % interval for Cpk:
 * Ĉpk ± z₀.₉₇₅·√(1/(9n) + Ĉpk²/(2(n − 1))).
 */
export function cpkConfidenceInterval(cpk: number, n: number): { lower: number; upper: number } {
  requireFinite('cpk', cpk);
  if (!Number.isInteger(n) || n < 2) throw new Error(`n must be an integer ≥ 2, got ${String(n)}`);
  const halfWidth = Z_975 * Math.sqrt(1 / (9 * n) + (cpk * cpk) / (2 * (n - 1)));
  return { lower: cpk - halfWidth, upper: cpk + halfWidth };
}

/** σ_within as the AIAG SPC manual defines it: MR̄/d₂(2), or R̄/d₂ / s̄/c₄ over consecutive subgroups. */
function sigmaWithin(values: readonly number[], options: CapabilityOptions): number {
  const size = options.subgroupSize ?? 1;
  requireIntegerInRange('options.subgroupSize', size, 1, MAX_SUBGROUP_SIZE);
  if (size === 1) return sigmaFromMovingRange(values);
  if (values.length % size !== 0) {
    throw new Error(`values.length (${values.length}) must be a multiple of options.subgroupSize (${size})`);
  }
  const subgroups: (readonly number[])[] = [];
  for (let i = 0; i < values.length; i += size) subgroups.push(values.slice(i, i + size));
  const method = options.withinMethod ?? 'range';
  if (method === 'range') return mean(subgroups.map(range)) / controlChartConstants(size).d2;
  if (method === 'stdDev') return mean(subgroups.map(sampleStdDev)) / c4(size);
  throw new Error(`options.withinMethod must be 'range' or 'stdDev', got ${String(method)}`);
}

function specLimit(name: string, limit: number | null | undefined): number | null {
  if (limit === undefined || limit === null) return null;
  requireFinite(name, limit);
  return limit;
}

/** Cp-type (both sides) and Cpk-type (nearer side) indices for one sigma. */
function indices(mu: number, sigma: number, lsl: number | null, usl: number | null): { whole: number | null; nearest: number } {
  const upper = usl === null ? Infinity : (usl - mu) / (3 * sigma);
  const lower = lsl === null ? Infinity : (mu - lsl) / (3 * sigma);
  const whole = lsl !== null && usl !== null ? (usl - lsl) / (6 * sigma) : null;
  return { whole, nearest: Math.min(upper, lower) };
}

/**
 * Process capability study (AIAG, Statistical Process Control reference manual, 2nd ed. 2005):
 * Cp = (USL − LSL)/6σ_within, Cpk = min(USL − μ, μ − LSL)/3σ_within; Pp, Ppk the same with
 * σ_overall, the sample standard deviation (n − 1). With one limit only, Cp/Pp are null and
 * Cpk/Ppk are Cpu/Ppu or Cpl/Ppl. Confidence bounds by Bissell (1990); ppm out of specification
 * from the normal model with σ_overall, because the long-run spread is what parts actually see;
 * normality by Anderson–Darling (D'Agostino & Stephens 1986).
 */
export function capability(values: readonly number[], options: CapabilityOptions): CapabilityStudy {
  requireFiniteArray('values', values, 3);
  if (options === null || typeof options !== 'object') throw new Error('options must be an object with lsl and/or usl');
  const lsl = specLimit('options.lsl', options.lsl);
  const usl = specLimit('options.usl', options.usl);
  if (lsl === null && usl === null) throw new Error('options.lsl or options.usl is required: capability needs a specification');
  if (lsl !== null && usl !== null && lsl >= usl) {
    throw new Error(`options.lsl (${lsl}) must be below options.usl (${usl})`);
  }

  const n = values.length;
  const mu = mean(values);
  const within = sigmaWithin(values, options);
  const overall = sampleStdDev(values);
  if (within === 0 || overall === 0) throw new Error('values must vary: capability is undefined with zero spread');

  const short = indices(mu, within, lsl, usl);
  const long = indices(mu, overall, lsl, usl);
  const bounds = cpkConfidenceInterval(short.nearest, n);
  const belowLsl = lsl === null ? 0 : normalCdf((lsl - mu) / overall);
  const aboveUsl = usl === null ? 0 : normalCdf((mu - usl) / overall);

  return {
    n,
    mean: mu,
    sigmaWithin: within,
    sigmaOverall: overall,
    cp: short.whole,
    cpk: short.nearest,
    pp: long.whole,
    ppk: long.nearest,
    cpkLower95: bounds.lower,
    cpkUpper95: bounds.upper,
    ppmOutOfSpec: 1e6 * (belowLsl + aboveUsl),
    normality: andersonDarlingNormality(values),
  };
}
