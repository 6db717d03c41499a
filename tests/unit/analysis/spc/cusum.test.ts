import { describe, expect, it } from 'vitest';
import { cusumChart } from '../../../../server/analysis/spc/index.js';

// Montgomery & Runger, Applied Statistics and Probability for Engineers, Example 16-6 (quoted in
// DOMAIN.md): μ₀ = 99, K = 1, H = 10 in data units.
const DATA = [
  102.0, 94.8, 98.3, 98.4, 102.0, 98.5, 99.0, 97.7, 100.0, 98.1, 101.3, 98.7, 101.1, 98.4, 97.0, 96.7, 100.3, 101.4,
  97.2, 101.0,
];
const S_H = [2.0, 0, 0, 0, 2.0, 0.5, 0, 0, 0, 0, 1.3, 0, 1.1, 0, 0, 0, 0.3, 1.7, 0, 1.0];
const S_L = [0, 3.2, 2.9, 2.5, 0, 0, 0, 0.3, 0, 0, 0, 0, 0, 0, 1.0, 2.3, 0, 0, 0.8, 0];

describe('cusumChart', () => {
  // sigma = 1 turns the σ-unit k and h into the book's data-unit K and H
  const chart = cusumChart(DATA, { k: 1, h: 10, target: 99, sigma: 1 });

  it('when given Montgomery & Runger Example 16-6, then S_H and S_L match the book to 0.1', () => {
    // by hand: S_H,1 = max(0, 102.0 − 100 + 0) = 2.0; S_L,2 = max(0, 98 − 94.8 + 0) = 3.2;
    // S_L,3 = max(0, 98 − 98.3 + 3.2) = 2.9
    chart.upper.forEach((value, i) => expect(Math.abs(value - S_H[i])).toBeLessThanOrEqual(0.05));
    chart.lower.forEach((value, i) => expect(Math.abs(value - S_L[i])).toBeLessThanOrEqual(0.05));
    expect(chart.upper).toHaveLength(20);
  });

  it('when given Montgomery & Runger Example 16-6, then there is no signal', () => {
    expect(chart.signals).toEqual([]);
  });

  it('when the process shifts up by 2σ, then the upper sum signals once it exceeds H', () => {
    // k = 0.5, h = 4 (NIST/SEMATECH §6.3.2.3 typical design); each value of 2 adds 2 − 0.5 = 1.5,
    // so C⁺ = 1.5, 3, 4.5 → first signal at the third shifted value
    const result = cusumChart([0, 0, 2, 2, 2, 2], { k: 0.5, h: 4, target: 0, sigma: 1 });
    expect(result.upper).toEqual([0, 0, 1.5, 3, 4.5, 6]);
    expect(result.signals).toEqual([
      { index: 4, side: 'upper' },
      { index: 5, side: 'upper' },
    ]);
  });

  it('when k and h are in σ units, then doubling σ doubles K and H', () => {
    const result = cusumChart([0, -3, -3, -3], { k: 0.5, h: 2, target: 0, sigma: 2 });
    // K = 1, H = 4: C⁻ = 0, 2, 4, 6 → signal only when 6 > 4
    expect(result.lower).toEqual([0, 2, 4, 6]);
    expect(result.signals).toEqual([{ index: 3, side: 'lower' }]);
  });

  it('when options are invalid, then it throws naming the option', () => {
    expect(() => cusumChart(DATA, { k: -1, h: 5 })).toThrow(/options.k must not be negative/);
    expect(() => cusumChart(DATA, { k: 0.5, h: 0 })).toThrow(/options.h must be greater than 0/);
    expect(() => cusumChart([1], { k: 0.5, h: 4 })).toThrow(/values must hold at least 2/);
  });
});
