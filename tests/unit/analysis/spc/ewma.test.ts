import { describe, expect, it } from 'vitest';
import { ewmaChart } from '../../../../server/analysis/spc/index.js';

// NIST/SEMATECH e-Handbook §6.3.2.4, EWMA example (quoted in DOMAIN.md): EWMA₀ = 50, s = 2.0539,
// λ = 0.3, k = 3, twenty values.
const NIST_DATA = [
  52.0, 47.0, 53.0, 49.3, 50.1, 47.0, 51.0, 50.1, 51.2, 50.5, 49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1,
];
// The handbook's EWMA column, printed to two decimals.
const NIST_Z = [
  50.6, 49.52, 50.56, 50.18, 50.16, 49.21, 49.75, 49.85, 50.26, 50.33, 50.11, 49.36, 49.52, 50.05, 49.38, 49.92, 50.73,
  51.23, 51.94, 51.99,
];

describe('ewmaChart', () => {
  const chart = ewmaChart(NIST_DATA, { lambda: 0.3, L: 3, target: 50, sigma: 2.0539 });

  it('when given the NIST example, then the asymptotic limits are 47.4115 and 52.5884', () => {
    // NIST/SEMATECH §6.3.2.4 (printed to four decimals)
    expect(Math.abs(chart.asymptoticLcl - 47.4115)).toBeLessThanOrEqual(1e-4);
    expect(Math.abs(chart.asymptoticUcl - 52.5884)).toBeLessThanOrEqual(1e-4);
  });

  it('when given the NIST example, then the z series matches the handbook to its two decimals', () => {
    // by hand: z₁ = 0.3·52 + 0.7·50 = 50.60; z₂ = 0.3·47 + 0.7·50.60 = 49.52;
    // z₃ = 0.3·53 + 0.7·49.52 = 50.564; z₄ = 0.3·49.3 + 0.7·50.564 = 50.1848
    expect(chart.points[0].z).toBeCloseTo(50.6, 12);
    expect(chart.points[1].z).toBeCloseTo(49.52, 12);
    expect(chart.points[2].z).toBeCloseTo(50.564, 12);
    expect(chart.points[3].z).toBeCloseTo(50.1848, 12);
    chart.points.forEach((point, i) => expect(point.z).toBeCloseTo(NIST_Z[i], 2));
  });

  it('when given the NIST example, then no point is out of control', () => {
    // NIST/SEMATECH §6.3.2.4, as quoted in DOMAIN.md: no point out of control
    expect(chart.points).toHaveLength(20);
    expect(chart.points.filter((p) => p.outOfControl)).toEqual([]);
  });

  it('when t grows, then the limits widen from L·σ·λ at t = 1 towards the asymptote', () => {
    // t = 1: √(λ/(2−λ)·(1 − (1−λ)²)) = √(0.3/1.7·0.51) = 0.3, i.e. exactly λ (NIST formula at t = 1)
    expect(chart.points[0].ucl - 50).toBeCloseTo(3 * 2.0539 * 0.3, 10);
    const widths = chart.points.map((p) => p.ucl - p.lcl);
    for (let i = 1; i < widths.length; i++) expect(widths[i]).toBeGreaterThan(widths[i - 1]);
    expect(chart.asymptoticUcl - widths[19] / 2 - 50).toBeLessThan(1e-5);
  });

  it('when a sustained shift enters, then the first out-of-control point is flagged', () => {
    const shifted = [...NIST_DATA, 54, 54, 54];
    const result = ewmaChart(shifted, { lambda: 0.3, L: 3, target: 50, sigma: 2.0539 });
    // z₂₁ = 0.3·54 + 0.7·51.988… ≈ 52.59 > 52.588 (limits are practically asymptotic by t = 21)
    expect(result.points.findIndex((p) => p.outOfControl)).toBe(20);
  });

  it('when target and sigma are omitted, then they default to the mean and MR̄/d₂(2)', () => {
    const result = ewmaChart([1, 3, 2, 4], { lambda: 0.2, L: 3 });
    expect(result.target).toBeCloseTo(2.5, 12);
    // MR̄ = (2 + 1 + 2)/3; d₂(2) = 2/√π (ASTM E2587)
    expect(result.sigma).toBeCloseTo(5 / 3 / (2 / Math.sqrt(Math.PI)), 9);
  });

  it('when λ or L is invalid, then it throws naming the option', () => {
    expect(() => ewmaChart(NIST_DATA, { lambda: 0, L: 3 })).toThrow(/options.lambda must be in \(0, 1\]/);
    expect(() => ewmaChart(NIST_DATA, { lambda: 1.2, L: 3 })).toThrow(/options.lambda/);
    expect(() => ewmaChart(NIST_DATA, { lambda: 0.2, L: -1 })).toThrow(/options.L must be greater than 0/);
    expect(() => ewmaChart(NIST_DATA, { lambda: 0.2, L: 3, sigma: 0 })).toThrow(/options.sigma/);
  });
});
