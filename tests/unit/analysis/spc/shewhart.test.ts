import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { individualsChart, xbarRChart, xbarSChart } from '../../../../server/analysis/spc/index.js';

// Montgomery & Runger, Applied Statistics and Probability for Engineers, Example 16-2 (the same
// 20 values as their CUSUM Example 16-6), as quoted in DOMAIN.md.
const MONTGOMERY_16_2 = [
  102.0, 94.8, 98.3, 98.4, 102.0, 98.5, 99.0, 97.7, 100.0, 98.1, 101.3, 98.7, 101.1, 98.4, 97.0, 96.7, 100.3, 101.4,
  97.2, 101.0,
];

describe('individualsChart', () => {
  it('when given Montgomery & Runger Example 16-2, then x̄, MR̄ and UCL match the book', () => {
    const chart = individualsChart(MONTGOMERY_16_2);
    // the book prints x̄ = 99.1, MR̄ = 2.59 and UCL ≈ 105.99 (= 99.1 + 3·2.59/1.128 with its rounded inputs)
    expect(Math.abs(chart.center - 99.1)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(chart.mr.center - 2.59)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(chart.ucl - 105.99)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(chart.lcl - (99.1 - (3 * 2.59) / 1.128))).toBeLessThanOrEqual(0.02);
  });

  it('when the limits are rebuilt with the handbook factors, then they agree (2.66·MR̄ and 3.267·MR̄)', () => {
    // NIST/SEMATECH §6.3.2.2 / DOMAIN.md: x̄ ± 2.66·MR̄, MR UCL = 3.267·MR̄, MR LCL = 0
    const chart = individualsChart(MONTGOMERY_16_2);
    const mrBar = chart.mr.center;
    // 2.66 is printed to two decimals (3/d₂(2) = 2.6587), so half a unit in its last place
    expect(Math.abs(chart.ucl - (chart.center + 2.66 * mrBar))).toBeLessThanOrEqual(5e-3 * mrBar);
    expect(Math.abs(chart.sigma - mrBar / 1.128)).toBeLessThanOrEqual(1e-3 * mrBar);
    expect(Math.abs(chart.mr.ucl - 3.267 * mrBar)).toBeLessThanOrEqual(1e-3 * mrBar);
    expect(chart.mr.lcl).toBe(0);
  });

  it('when there are fewer than two values or a value is not finite, then it throws naming values', () => {
    expect(() => individualsChart([1])).toThrow(/values must hold at least 2/);
    expect(() => individualsChart([1, Number.NaN, 3])).toThrow(/values\[1\] must be a finite number/);
  });
});

// made-up resistance readings in mΩ
const FOUR_EACH = [
  [10.2, 9.9, 10.4, 10.1],
  [9.8, 10.0, 10.3, 9.7],
  [10.5, 10.1, 9.9, 10.2],
  [10.0, 9.6, 10.1, 10.3],
  [9.9, 10.4, 10.2, 10.0],
];

describe('xbarRChart', () => {
  it('when subgroups are equal in size, then the limits are x̿ ± A₂R̄, D₃R̄ and D₄R̄ from the table', () => {
    // NIST/SEMATECH §6.3.2 table for n = 4: A₂ = 0.729, D₃ = 0, D₄ = 2.282, d₂ = 2.059
    const grand = jStat.mean(FOUR_EACH.flat());
    const rBar = jStat.mean(FOUR_EACH.map((s) => jStat.range(s)));
    const chart = xbarRChart(FOUR_EACH);
    const tolerance = 1e-3 * rBar;
    expect(chart.xbar.center).toBeCloseTo(grand, 12);
    expect(Math.abs(chart.xbar.ucl - (grand + 0.729 * rBar))).toBeLessThanOrEqual(tolerance);
    expect(Math.abs(chart.xbar.lcl - (grand - 0.729 * rBar))).toBeLessThanOrEqual(tolerance);
    expect(chart.range.center).toBeCloseTo(rBar, 12);
    expect(Math.abs(chart.range.ucl - 2.282 * rBar)).toBeLessThanOrEqual(tolerance);
    expect(chart.range.lcl).toBe(0);
    expect(Math.abs(chart.sigma - rBar / 2.059)).toBeLessThanOrEqual(tolerance);
    expect(chart.subgroupSize).toBe(4);
    expect(chart.perSubgroup).toBeUndefined();
  });

  it('when subgroup sizes differ, then each subgroup gets limits for its own n from σ̂ = mean(Rᵢ/d₂(nᵢ))', () => {
    // table d₂, d₃ (NIST/SEMATECH §6.3.2): n = 3: 1.693, 0.888; n = 4: 2.059, 0.880; n = 5: 2.326, 0.864
    const table: Record<number, { d2: number; d3: number }> = {
      3: { d2: 1.693, d3: 0.888 },
      4: { d2: 2.059, d3: 0.88 },
      5: { d2: 2.326, d3: 0.864 },
    };
    const subgroups = [[10.2, 9.9, 10.4], [9.8, 10.0, 10.3, 9.7, 10.1], [10.5, 10.1, 9.9, 10.2]];
    const grand = jStat.mean(subgroups.flat());
    const sigma = jStat.mean(subgroups.map((s) => jStat.range(s) / table[s.length].d2));
    const chart = xbarRChart(subgroups);
    expect(chart.xbar.center).toBeCloseTo(grand, 12);
    expect(Math.abs(chart.sigma - sigma)).toBeLessThanOrEqual(1e-3 * sigma);
    expect(chart.perSubgroup?.map((p) => p.n)).toEqual([3, 5, 4]);
    chart.perSubgroup?.forEach((limits, i) => {
      const { d2, d3 } = table[subgroups[i].length];
      const n = subgroups[i].length;
      expect(Math.abs(limits.xbar.ucl - (grand + (3 * sigma) / Math.sqrt(n)))).toBeLessThanOrEqual(2e-3 * sigma);
      expect(Math.abs(limits.range.center - d2 * sigma)).toBeLessThanOrEqual(2e-3 * sigma);
      expect(Math.abs(limits.range.ucl - (d2 + 3 * d3) * sigma)).toBeLessThanOrEqual(5e-3 * sigma);
      expect(limits.range.lcl).toBe(0);
    });
    // the summary line is drawn for the rounded average size, (3 + 5 + 4)/3 = 4
    expect(chart.subgroupSize).toBe(4);
  });

  it('when a subgroup is too small or too large, then it throws naming that subgroup', () => {
    expect(() => xbarRChart([])).toThrow(/subgroups must be a non-empty array/);
    expect(() => xbarRChart([[1, 2], [3]])).toThrow(/subgroups\[1\] must hold at least 2/);
    expect(() => xbarRChart([Array.from({ length: 26 }, (_, i) => i)])).toThrow(/subgroups\[0\] must hold at most 25/);
  });
});

// made-up bore diameters in mm; the checks are against table factors, not a book's results
const FIVE_EACH = [
  [52.031, 52.004, 52.017, 51.994, 52.01],
  [51.996, 51.99, 52.003, 52.012, 52.005],
  [51.987, 52.022, 52.018, 52.006, 52.001],
  [52.003, 51.998, 51.991, 52.014, 52.011],
];

/** c₄(n) from jstat's gamma function, the reference for the X̄-S checks. */
function c4Reference(n: number): number {
  return Math.sqrt(2 / (n - 1)) * (jStat.gammafn(n / 2) / jStat.gammafn((n - 1) / 2));
}

describe('xbarSChart', () => {
  it('when subgroups are equal in size, then the limits are x̿ ± A₃s̄, B₃s̄ and B₄s̄ from the table', () => {
    // NIST/SEMATECH §6.3.2 table for n = 5: A₃ = 1.427, B₃ = 0, B₄ = 2.089, c₄ = 0.9400
    const grand = jStat.mean(FIVE_EACH.flat());
    const sBar = jStat.mean(FIVE_EACH.map((s) => jStat.stdev(s, true)));
    const chart = xbarSChart(FIVE_EACH);
    const tolerance = 1e-3 * sBar;
    expect(Math.abs(chart.xbar.ucl - (grand + 1.427 * sBar))).toBeLessThanOrEqual(tolerance);
    expect(Math.abs(chart.xbar.lcl - (grand - 1.427 * sBar))).toBeLessThanOrEqual(tolerance);
    expect(chart.stdDev.center).toBeCloseTo(sBar, 12);
    expect(Math.abs(chart.stdDev.ucl - 2.089 * sBar)).toBeLessThanOrEqual(tolerance);
    expect(chart.stdDev.lcl).toBe(0);
    expect(Math.abs(chart.sigma - sBar / 0.94)).toBeLessThanOrEqual(tolerance);
    expect(chart.perSubgroup).toBeUndefined();
  });

  it('when subgroup sizes differ, then σ̂ is the pooled s over c₄(ν+1) and limits follow each nᵢ', () => {
    // pooled s as in Montgomery (ISQC, x̄-s with variable sample size), recomputed with jstat
    const subgroups = [FIVE_EACH[0], FIVE_EACH[1].slice(0, 3), FIVE_EACH[2].slice(0, 4), FIVE_EACH[3]];
    const dof = subgroups.reduce((sum, s) => sum + s.length - 1, 0);
    const pooled = Math.sqrt(
      subgroups.reduce((sum, s) => sum + (s.length - 1) * jStat.variance(s, true), 0) / dof,
    );
    const sigma = pooled / c4Reference(dof + 1);
    const grand = jStat.mean(subgroups.flat());
    const chart = xbarSChart(subgroups);
    expect(chart.sigma / sigma).toBeCloseTo(1, 8);
    chart.perSubgroup?.forEach((limits, i) => {
      const n = subgroups[i].length;
      const c = c4Reference(n);
      expect(limits.n).toBe(n);
      expect(limits.xbar.lcl).toBeCloseTo(grand - (3 * sigma) / Math.sqrt(n), 8);
      expect(limits.stdDev.center).toBeCloseTo(c * sigma, 8);
      expect(limits.stdDev.ucl).toBeCloseTo((c + 3 * Math.sqrt(1 - c * c)) * sigma, 8);
      expect(limits.stdDev.lcl).toBeCloseTo(Math.max(0, c - 3 * Math.sqrt(1 - c * c)) * sigma, 8);
    });
    expect(chart.perSubgroup).toHaveLength(4);
  });
});
