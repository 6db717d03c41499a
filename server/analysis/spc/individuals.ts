import { controlChartConstants } from './constants.js';
import { averageMovingRange, mean } from './descriptive.js';
import type { ControlLimits } from './types.js';
import { requireFiniteArray } from './validate.js';

export interface IndividualsChart extends ControlLimits {
  /** σ̂ = MR̄/d₂(2), the short-term standard deviation behind the limits */
  sigma: number;
  /** the companion moving-range chart (span 2) */
  mr: ControlLimits;
}

/**
 * Individuals and moving-range (I-MR) chart (NIST/SEMATECH e-Handbook §6.3.2.2; Montgomery &
 * Runger, Applied Statistics and Probability for Engineers, Example 16-2): centre x̄, σ̂ = MR̄/d₂(2),
 * limits x̄ ± 3σ̂; MR chart centre MR̄, UCL = D₄(2)·MR̄, LCL = 0 (D₃(2) = 0).
 */
export function individualsChart(values: readonly number[]): IndividualsChart {
  requireFiniteArray('values', values, 2);
  const { d2, D4 } = controlChartConstants(2);
  const center = mean(values);
  const mrBar = averageMovingRange(values);
  const sigma = mrBar / d2;
  return {
    center,
    ucl: center + 3 * sigma,
    lcl: center - 3 * sigma,
    sigma,
    mr: { center: mrBar, ucl: D4 * mrBar, lcl: 0 },
  };
}
