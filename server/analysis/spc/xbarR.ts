import { MAX_SUBGROUP_SIZE, MIN_SUBGROUP_SIZE, controlChartConstants } from './constants.js';
import { range } from './descriptive.js';
import { summarizeSubgroups } from './subgroups.js';
import type { ControlLimits, SubgroupMeanLimits } from './types.js';

export interface XbarRSubgroupLimits {
  n: number;
  xbar: SubgroupMeanLimits;
  range: ControlLimits;
}

export interface XbarRChart {
  xbar: ControlLimits;
  range: ControlLimits;
  /** σ̂ = R̄/d₂ (equal sizes) or the mean of Rᵢ/d₂(nᵢ) (unequal sizes) */
  sigma: number;
  /** the subgroup size the summary limits are drawn for (see SubgroupSummary) */
  subgroupSize: number;
  /** present only when subgroup sizes differ: the exact limits for each subgroup, in order */
  perSubgroup?: XbarRSubgroupLimits[];
}

/**
 * Limits for a subgroup of size n given σ̂: x̿ ± 3σ̂/√n; R chart d₂σ̂ with limits
 * max(0, d₂ − 3d₃)·σ̂ and (d₂ + 3d₃)·σ̂. With σ̂ = R̄/d₂ these are exactly x̿ ± A₂R̄, D₃R̄, D₄R̄.
 */
function limitsFor(n: number, grandMean: number, sigma: number): XbarRSubgroupLimits {
  const { d2, d3 } = controlChartConstants(n);
  const halfWidth = (3 * sigma) / Math.sqrt(n);
  return {
    n,
    xbar: { ucl: grandMean + halfWidth, lcl: grandMean - halfWidth },
    range: { center: d2 * sigma, ucl: (d2 + 3 * d3) * sigma, lcl: Math.max(0, d2 - 3 * d3) * sigma },
  };
}

/**
 * X̄-R chart (ASTM E2587; NIST/SEMATECH e-Handbook §6.3.2.1; Montgomery, Introduction to
 * Statistical Quality Control §6.2) for subgroups of 2…25 values. Equal sizes: x̿ ± A₂R̄, R̄ with
 * D₃R̄ and D₄R̄. Unequal sizes: σ̂ is the mean of Rᵢ/d₂(nᵢ), each term unbiased for σ (common
 * practice), and every subgroup gets limits for its own nᵢ in `perSubgroup`.
 */
export function xbarRChart(subgroups: readonly (readonly number[])[]): XbarRChart {
  const summary = summarizeSubgroups(subgroups, MIN_SUBGROUP_SIZE, MAX_SUBGROUP_SIZE);
  let sigmaSum = 0;
  subgroups.forEach((subgroup, i) => {
    sigmaSum += range(subgroup) / controlChartConstants(summary.sizes[i]).d2;
  });
  const sigma = sigmaSum / subgroups.length;
  const overall = limitsFor(summary.representativeSize, summary.grandMean, sigma);
  const chart: XbarRChart = {
    xbar: { center: summary.grandMean, ...overall.xbar },
    range: overall.range,
    sigma,
    subgroupSize: summary.representativeSize,
  };
  if (!summary.equalSizes) {
    chart.perSubgroup = summary.sizes.map((n) => limitsFor(n, summary.grandMean, sigma));
  }
  return chart;
}
