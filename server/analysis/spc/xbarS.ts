import { c4 } from './constants.js';
import { sampleStdDev } from './descriptive.js';
import { summarizeSubgroups } from './subgroups.js';
import type { ControlLimits, SubgroupMeanLimits } from './types.js';

export interface XbarSSubgroupLimits {
  n: number;
  xbar: SubgroupMeanLimits;
  stdDev: ControlLimits;
}

export interface XbarSChart {
  xbar: ControlLimits;
  stdDev: ControlLimits;
  /** σ̂ = s̄/c₄(n) (equal sizes) or s_p/c₄(ν + 1) with the pooled s_p (unequal sizes) */
  sigma: number;
  /** the subgroup size the summary limits are drawn for (see SubgroupSummary) */
  subgroupSize: number;
  /** present only when subgroup sizes differ: the exact limits for each subgroup, in order */
  perSubgroup?: XbarSSubgroupLimits[];
}

/**
 * Limits for a subgroup of size n given σ̂: x̿ ± 3σ̂/√n; s chart c₄σ̂ with limits
 * (c₄ ∓ 3√(1 − c₄²))·σ̂ (the B₅, B₆ form). With σ̂ = s̄/c₄ these are exactly x̿ ± A₃s̄, B₃s̄, B₄s̄.
 */
function limitsFor(n: number, grandMean: number, sigma: number): XbarSSubgroupLimits {
  const c = c4(n);
  const spread = 3 * Math.sqrt(1 - c * c);
  const halfWidth = (3 * sigma) / Math.sqrt(n);
  return {
    n,
    xbar: { ucl: grandMean + halfWidth, lcl: grandMean - halfWidth },
    stdDev: { center: c * sigma, ucl: (c + spread) * sigma, lcl: Math.max(0, c - spread) * sigma },
  };
}

/**
 * σ̂ from subgroup standard deviations. Equal sizes: s̄/c₄(n) (ASTM E2587; NIST/SEMATECH §6.3.2.1).
 * Unequal sizes: the pooled s_p = √(Σ(nᵢ − 1)sᵢ² / Σ(nᵢ − 1)) (Montgomery, ISQC §6.3.2), made
 * unbiased with c₄(ν + 1), ν = Σ(nᵢ − 1), because νs_p²/σ² is χ² with ν degrees of freedom.
 */
function estimateSigma(subgroups: readonly (readonly number[])[], sizes: number[], equalSizes: boolean): number {
  const sds = subgroups.map(sampleStdDev);
  if (equalSizes) return sds.reduce((a, b) => a + b, 0) / sds.length / c4(sizes[0]);
  let sumSquares = 0;
  let dof = 0;
  sds.forEach((s, i) => {
    sumSquares += (sizes[i] - 1) * s * s;
    dof += sizes[i] - 1;
  });
  return Math.sqrt(sumSquares / dof) / c4(dof + 1);
}

/**
 * X̄-S chart (ASTM E2587; NIST/SEMATECH e-Handbook §6.3.2.1; Montgomery, ISQC §6.3) for subgroups
 * of two or more values. Equal sizes: x̿ ± A₃s̄, s̄ with B₃s̄ and B₄s̄. Unequal sizes: σ̂ from the
 * pooled standard deviation and per-subgroup limits for each nᵢ in `perSubgroup`.
 */
export function xbarSChart(subgroups: readonly (readonly number[])[]): XbarSChart {
  const summary = summarizeSubgroups(subgroups, 2, Number.MAX_SAFE_INTEGER);
  const sigma = estimateSigma(subgroups, summary.sizes, summary.equalSizes);
  const overall = limitsFor(summary.representativeSize, summary.grandMean, sigma);
  const chart: XbarSChart = {
    xbar: { center: summary.grandMean, ...overall.xbar },
    stdDev: overall.stdDev,
    sigma,
    subgroupSize: summary.representativeSize,
  };
  if (!summary.equalSizes) {
    chart.perSubgroup = summary.sizes.map((n) => limitsFor(n, summary.grandMean, sigma));
  }
  return chart;
}
