import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { andersonDarlingPValue } from '../../../../server/analysis/spc/andersonDarling.js';
import { andersonDarlingNormality, capability } from '../../../../server/analysis/spc/index.js';

/** A² by its definition (Stephens 1974), evaluated with jstat's normal CDF as the reference. */
function referenceASquared(values: number[]): number {
  const n = values.length;
  const mean = jStat.mean(values);
  const sd = jStat.stdev(values, true);
  const F = [...values].sort((a, b) => a - b).map((x) => jStat.normal.cdf(x, mean, sd));
  let sum = 0;
  for (let i = 1; i <= n; i++) sum += (2 * i - 1) * (Math.log(F[i - 1]) + Math.log(1 - F[n - i]));
  return -n - sum / n;
}

const idealNormal = Array.from({ length: 50 }, (_, i) => jStat.normal.inv((i + 0.5) / 50, 10, 2));
const idealExponential = Array.from({ length: 50 }, (_, i) => -Math.log(1 - (i + 0.5) / 50));
const MONTGOMERY_16_2 = [
  102.0, 94.8, 98.3, 98.4, 102.0, 98.5, 99.0, 97.7, 100.0, 98.1, 101.3, 98.7, 101.1, 98.4, 97.0, 96.7, 100.3, 101.4,
  97.2, 101.0,
];

describe('andersonDarlingNormality', () => {
  it('when computed on several samples, then A² equals the definition evaluated with jstat', () => {
    for (const sample of [idealNormal, idealExponential, MONTGOMERY_16_2]) {
      expect(andersonDarlingNormality(sample).andersonDarling).toBeCloseTo(referenceASquared(sample), 8);
    }
  });

  it('when computed, then A*² is A²·(1 + 0.75/n + 2.25/n²) (D’Agostino & Stephens 1986)', () => {
    const result = andersonDarlingNormality(MONTGOMERY_16_2);
    expect(result.andersonDarlingAdjusted).toBeCloseTo(result.andersonDarling * (1 + 0.75 / 20 + 2.25 / 400), 12);
  });

  it('when the data are ideal normal quantiles, then normality is not rejected (p > 0.5)', () => {
    expect(andersonDarlingNormality(idealNormal).pValue).toBeGreaterThan(0.5);
  });

  it('when the data are exponential quantiles, then normality is rejected (p < 0.01)', () => {
    expect(andersonDarlingNormality(idealExponential).pValue).toBeLessThan(0.01);
  });

  it('when the capability study runs, then it reports the same normality test', () => {
    const study = capability(idealExponential, { usl: 5 });
    expect(study.normality).toEqual(andersonDarlingNormality(idealExponential));
  });

  it('when all values are equal, then it throws naming values', () => {
    expect(() => andersonDarlingNormality([3, 3, 3])).toThrow(/values must not all be equal/);
  });
});

describe('andersonDarlingPValue', () => {
  it('when A*² sits on a published critical value, then p is close to its significance level', () => {
    // D'Agostino & Stephens (1986) Table 4.7, normal case with both parameters estimated,
    // modified statistic A²(1 + 0.75/n + 2.25/n²): 10 % 0.631, 5 % 0.752, 2.5 % 0.873, 1 % 1.035
    // (from memory); the Table 4.9 formula is an approximation, so 10 % relative tolerance.
    const critical: [number, number][] = [
      [0.631, 0.1],
      [0.752, 0.05],
      [0.873, 0.025],
      [1.035, 0.01],
    ];
    for (const [aStar, alpha] of critical) {
      expect(Math.abs(andersonDarlingPValue(aStar) / alpha - 1)).toBeLessThan(0.1);
    }
  });

  it('when A*² crosses a branch boundary of Table 4.9, then p barely jumps', () => {
    for (const edge of [0.2, 0.34, 0.6]) {
      expect(Math.abs(andersonDarlingPValue(edge - 1e-12) - andersonDarlingPValue(edge))).toBeLessThan(0.005);
    }
  });

  it('when A*² is huge, then p is 0 and never rises again', () => {
    expect(andersonDarlingPValue(20)).toBeLessThan(1e-40);
    expect(andersonDarlingPValue(200)).toBe(0);
  });
});
