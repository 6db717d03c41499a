import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { capability, cpkConfidenceInterval } from '../../../../server/analysis/spc/index.js';

const SMALL = [10.2, 9.8, 10.1, 10.4, 9.9, 10.0, 10.3, 9.7, 10.1, 10.0, 10.2, 9.9];

function movingRangeMean(values: number[]): number {
  let sum = 0;
  for (let i = 1; i < values.length; i++) sum += Math.abs(values[i] - values[i - 1]);
  return sum / (values.length - 1);
}

/** n ideal normal quantiles Φ⁻¹((i − 0.5)/n) from jstat: a sample with no sampling noise. */
function idealNormal(n: number): number[] {
  return Array.from({ length: n }, (_, i) => jStat.normal.inv((i + 0.5) / n, 0, 1));
}

describe('capability', () => {
  it('when given individuals and two limits, then Cp, Cpk, Pp, Ppk follow the AIAG definitions', () => {
    // AIAG SPC manual: σ_within = MR̄/d₂(2) with d₂(2) = 2/√π (ASTM E2587), σ_overall = s (n − 1)
    const lsl = 9.4;
    const usl = 10.9;
    const mu = jStat.mean(SMALL);
    const within = movingRangeMean(SMALL) / (2 / Math.sqrt(Math.PI));
    const overall = jStat.stdev(SMALL, true);
    const study = capability(SMALL, { lsl, usl });
    expect(study.n).toBe(12);
    expect(study.mean).toBeCloseTo(mu, 12);
    expect(study.sigmaWithin).toBeCloseTo(within, 9);
    expect(study.sigmaOverall).toBeCloseTo(overall, 12);
    expect(study.cp).toBeCloseTo((usl - lsl) / (6 * within), 9);
    expect(study.cpk).toBeCloseTo(Math.min(usl - mu, mu - lsl) / (3 * within), 9);
    expect(study.pp).toBeCloseTo((usl - lsl) / (6 * overall), 9);
    expect(study.ppk).toBeCloseTo(Math.min(usl - mu, mu - lsl) / (3 * overall), 9);
  });

  it('when a subgroup size is given, then σ_within is R̄/d₂ or s̄/c₄ over consecutive subgroups', () => {
    // NIST/SEMATECH §6.3.2 table, n = 4: d₂ = 2.059, c₄ = 0.9213
    const groups = [SMALL.slice(0, 4), SMALL.slice(4, 8), SMALL.slice(8, 12)];
    const rBar = jStat.mean(groups.map((g) => jStat.range(g)));
    const sBar = jStat.mean(groups.map((g) => jStat.stdev(g, true)));
    const byRange = capability(SMALL, { lsl: 9.4, usl: 10.9, subgroupSize: 4 });
    const byStdDev = capability(SMALL, { lsl: 9.4, usl: 10.9, subgroupSize: 4, withinMethod: 'stdDev' });
    expect(byRange.sigmaWithin / (rBar / 2.059)).toBeCloseTo(1, 3);
    expect(byStdDev.sigmaWithin / (sBar / 0.9213)).toBeCloseTo(1, 3);
  });

  it('when only an upper limit is given, then Cp and Pp are null and Cpk is Cpu', () => {
    const usl = 10.6;
    const mu = jStat.mean(SMALL);
    const within = movingRangeMean(SMALL) / (2 / Math.sqrt(Math.PI));
    const overall = jStat.stdev(SMALL, true);
    const study = capability(SMALL, { usl });
    expect(study.cp).toBeNull();
    expect(study.pp).toBeNull();
    expect(study.cpk).toBeCloseTo((usl - mu) / (3 * within), 9);
    expect(study.ppk).toBeCloseTo((usl - mu) / (3 * overall), 9);
    // normal model with σ_overall, jstat as the reference CDF
    expect(study.ppmOutOfSpec).toBeCloseTo(1e6 * (1 - jStat.normal.cdf(usl, mu, overall)), 4);
  });

  it('when the process is centred with Pp = 1.00, then about 2700 ppm fall outside', () => {
    // common knowledge: ±3σ leaves 0.27 %; reference 2·Φ(−3) from jstat
    const values = idealNormal(400);
    const mu = jStat.mean(values);
    const sd = jStat.stdev(values, true);
    const study = capability(values, { lsl: mu - 3 * sd, usl: mu + 3 * sd });
    expect(study.pp).toBeCloseTo(1, 12);
    expect(study.ppmOutOfSpec / (2e6 * jStat.normal.cdf(-3, 0, 1))).toBeCloseTo(1, 8);
    expect(Math.abs(study.ppmOutOfSpec - 2700)).toBeLessThan(1);
  });

  it('when the process is centred with Pp = 1.33, then about 66 ppm fall outside', () => {
    // common knowledge: Cp 1.33 ↔ ±3.99σ ↔ 66 ppm; reference 2·Φ(−3.99) from jstat
    const values = idealNormal(400);
    const mu = jStat.mean(values);
    const sd = jStat.stdev(values, true);
    const study = capability(values, { lsl: mu - 3.99 * sd, usl: mu + 3.99 * sd });
    expect(study.pp).toBeCloseTo(1.33, 12);
    expect(study.ppmOutOfSpec / (2e6 * jStat.normal.cdf(-3.99, 0, 1))).toBeCloseTo(1, 8);
    expect(Math.abs(study.ppmOutOfSpec - 66)).toBeLessThan(0.5);
  });

  it('when the study reports Cpk bounds, then they are Bissell’s interval for its Cpk and n', () => {
    const study = capability(SMALL, { lsl: 9.4, usl: 10.9 });
    const z = jStat.normal.inv(0.975, 0, 1);
    const half = z * Math.sqrt(1 / (9 * 12) + study.cpk ** 2 / (2 * 11));
    expect(study.cpkLower95).toBeCloseTo(study.cpk - half, 9);
    expect(study.cpkUpper95).toBeCloseTo(study.cpk + half, 9);
  });

  it('when inputs are bad, then the error names the argument', () => {
    expect(() => capability(SMALL, {})).toThrow(/options.lsl or options.usl is required/);
    expect(() => capability(SMALL, { lsl: 11, usl: 10 })).toThrow(/options.lsl \(11\) must be below options.usl/);
    expect(() => capability(SMALL, { lsl: 9, subgroupSize: 5 })).toThrow(/values.length \(12\) must be a multiple/);
    expect(() => capability(SMALL, { lsl: 9, subgroupSize: 30 })).toThrow(/options.subgroupSize must be an integer/);
    expect(() => capability([5, 5, 5, 5], { lsl: 4 })).toThrow(/values must vary/);
    expect(() => capability([1, 2], { lsl: 0 })).toThrow(/values must hold at least 3/);
  });
});

describe('cpkConfidenceInterval', () => {
  it('when Cpk = 1.15 from n = 45, then the 95 % interval is 0.89 to 1.41', () => {
    // Quality Digest, May 2000 (Bissell's approximation), quoted in DOMAIN.md
    const { lower, upper } = cpkConfidenceInterval(1.15, 45);
    expect(Math.abs(lower - 0.89)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(upper - 1.41)).toBeLessThanOrEqual(0.005);
  });

  it('when n is too small, then it throws naming n', () => {
    expect(() => cpkConfidenceInterval(1.2, 1)).toThrow(/n must be an integer ≥ 2/);
  });
});
