import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { logNormalCdf, normalCdf, Z_975 } from '../../../../server/analysis/spc/normal.js';

describe('normalCdf', () => {
  it('when evaluated across −5.5…8, then it agrees with jstat to 1e-9 relative', () => {
    // jstat.normal.cdf (npm jstat 1.9.6) as the independent reference; below −5.5 jstat's own erfc
    // loses relative accuracy (1e-8 at −5.95, 1.9 % at −8), so the far tail is checked against published values.
    for (let k = -110; k <= 160; k++) {
      const x = k / 20;
      const reference = jStat.normal.cdf(x, 0, 1);
      expect(Math.abs(normalCdf(x) - reference) / reference).toBeLessThan(1e-9);
    }
  });

  it('when evaluated at tabulated points, then it matches the published tail probabilities', () => {
    // Φ(0) = 1/2 by symmetry; Φ(−1.96) = 0.0249979, Φ(−3) = 0.00134990, Φ(−6) = 9.8658765e-10
    // Φ(−8) = 6.2209606e-16 (Abramowitz & Stegun Table 26.1 tail values, from memory)
    expect(normalCdf(0)).toBe(0.5);
    expect(normalCdf(-1.96)).toBeCloseTo(0.0249979, 7);
    expect(normalCdf(-3) / 0.0013498980).toBeCloseTo(1, 7);
    expect(normalCdf(-6) / 9.8658765e-10).toBeCloseTo(1, 7);
    expect(normalCdf(-8) / 6.2209606e-16).toBeCloseTo(1, 7);
  });

  it('when x is far in the lower tail, then ln Φ(x) stays finite and follows the Mills-ratio asymptote', () => {
    // Mills ratio (A&S 26.2.12): Φ(−x) ≈ φ(x)/x·(1 − 1/x² + 3/x⁴) for large x
    const x = 40;
    const asymptote = -x * x / 2 - Math.log(x * Math.sqrt(2 * Math.PI)) + Math.log(1 - 1 / x ** 2 + 3 / x ** 4);
    expect(logNormalCdf(-x)).toBeCloseTo(asymptote, 6);
  });

  it('when x is NaN, then it throws naming x', () => {
    expect(() => normalCdf(Number.NaN)).toThrow(/x must be a number/);
  });

  it('when the 95 % quantile constant is used, then it is Φ⁻¹(0.975) per jstat', () => {
    expect(Z_975).toBeCloseTo(jStat.normal.inv(0.975, 0, 1), 12);
    expect(normalCdf(Z_975)).toBeCloseTo(0.975, 12);
  });
});
