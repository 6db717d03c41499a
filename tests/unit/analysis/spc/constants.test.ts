import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { c4 } from '../../../../server/analysis/spc/constants.js';
import { controlChartConstants, type ControlChartConstants } from '../../../../server/analysis/spc/index.js';

// Printed factors, NIST/SEMATECH e-Handbook §6.3.2 and ASTM E2587 tables (n = 25 row from the
// ASTM MNL 7 table, from memory). Printed tables round in the third decimal, hence 1e-3.
const PUBLISHED: Record<number, Partial<ControlChartConstants>> = {
  2: { d2: 1.128, d3: 0.853, c4: 0.7979, A2: 1.88, A3: 2.659, B3: 0, B4: 3.267, D3: 0, D4: 3.267 },
  5: { d2: 2.326, d3: 0.864, c4: 0.94, A2: 0.577, A3: 1.427, B3: 0, B4: 2.089, D3: 0, D4: 2.114 },
  10: { d2: 3.078, d3: 0.797, c4: 0.9727, A2: 0.308, A3: 0.975, B3: 0.284, B4: 1.716, D3: 0.223, D4: 1.777 },
  25: { d2: 3.931, d3: 0.708, c4: 0.9896, A2: 0.153, A3: 0.606, B3: 0.565, B4: 1.435, D3: 0.459, D4: 1.541 },
};

describe('controlChartConstants', () => {
  it.each(Object.keys(PUBLISHED).map(Number))('when n = %i, then every factor matches the published table to 1e-3', (n) => {
    const computed = controlChartConstants(n);
    for (const [name, value] of Object.entries(PUBLISHED[n])) {
      expect(Math.abs(computed[name as keyof ControlChartConstants] - value), name).toBeLessThanOrEqual(1e-3);
    }
  });

  it('when n = 2 or 3, then d₂, d₃ and c₄ equal their closed forms', () => {
    // d₂(2) = 2/√π and c₄(2) = √(2/π) (ASTM E2587 / DOMAIN.md); for n = 2 the range is |X₁ − X₂|
    // with X₁ − X₂ ~ N(0, 2), so E[W²] = 2 and d₃(2) = √(2 − 4/π); d₂(3) = 3/√π (Tippett 1925).
    const two = controlChartConstants(2);
    expect(two.d2).toBeCloseTo(2 / Math.sqrt(Math.PI), 9);
    expect(two.c4).toBeCloseTo(Math.sqrt(2 / Math.PI), 12);
    expect(two.d3).toBeCloseTo(Math.sqrt(2 - 4 / Math.PI), 9);
    expect(controlChartConstants(3).d2).toBeCloseTo(3 / Math.sqrt(Math.PI), 9);
  });

  it('when c₄ is computed for any n, then it equals √(2/(n−1))·Γ(n/2)/Γ((n−1)/2) with jstat gamma', () => {
    // jstat.gammafn as the independent gamma function (its own accuracy is about 1e-9)
    for (let n = 2; n <= 100; n++) {
      const reference = Math.sqrt(2 / (n - 1)) * (jStat.gammafn(n / 2) / jStat.gammafn((n - 1) / 2));
      expect(c4(n)).toBeCloseTo(reference, 8);
    }
  });

  it('when d₂ is integrated independently with jstat’s normal CDF, then it agrees for every n', () => {
    // midpoint rule on [−10, 10] with jstat.normal.cdf: a different rule and a different Φ
    const steps = 8000;
    const width = 20 / steps;
    for (let n = 2; n <= 25; n++) {
      let integral = 0;
      for (let k = 0; k < steps; k++) {
        const F = jStat.normal.cdf(-10 + (k + 0.5) * width, 0, 1);
        integral += (1 - F ** n - (1 - F) ** n) * width;
      }
      expect(controlChartConstants(n).d2).toBeCloseTo(integral, 7);
    }
  });

  it('when the derived factors are recomputed from d₂, d₃, c₄, then they follow the ASTM E2587 definitions', () => {
    for (let n = 2; n <= 25; n++) {
      const k = controlChartConstants(n);
      expect(k.A2).toBeCloseTo(3 / (k.d2 * Math.sqrt(n)), 12);
      expect(k.A3).toBeCloseTo(3 / (k.c4 * Math.sqrt(n)), 12);
      expect(k.D3).toBeCloseTo(Math.max(0, 1 - (3 * k.d3) / k.d2), 12);
      expect(k.D4).toBeCloseTo(1 + (3 * k.d3) / k.d2, 12);
      expect(k.B3).toBeCloseTo(Math.max(0, 1 - (3 * Math.sqrt(1 - k.c4 ** 2)) / k.c4), 12);
      expect(k.B4).toBeCloseTo(1 + (3 * Math.sqrt(1 - k.c4 ** 2)) / k.c4, 12);
    }
  });

  it('when asked twice for the same n, then the cached, frozen object is returned', () => {
    const first = controlChartConstants(7);
    expect(controlChartConstants(7)).toBe(first);
    expect(Object.isFrozen(first)).toBe(true);
  });

  it('when n is outside 2…25 or not an integer, then it throws naming n', () => {
    for (const bad of [1, 26, 2.5, Number.NaN]) {
      expect(() => controlChartConstants(bad)).toThrow(/n \(subgroup size\) must be an integer from 2 to 25/);
    }
  });
});
