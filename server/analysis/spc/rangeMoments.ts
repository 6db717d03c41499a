import { normalCdf } from './normal.js';

/**
 * Mean and standard deviation of the range W of n independent standard normal values, the d₂ and
 * d₃ of control-chart tables (ASTM E2587; NIST/SEMATECH e-Handbook §6.3.2), by numerical
 * integration of their defining integrals (Tippett 1925; Harter 1960):
 *
 *   E[W]  = ∫ (1 − Φ(x)ⁿ − (1 − Φ(x))ⁿ) dx
 *   E[W²] = 2 ∫∫_{s<t} (1 − Φ(t)ⁿ − (1 − Φ(s))ⁿ + (Φ(t) − Φ(s))ⁿ) ds dt
 *
 * The second follows from W = ∫ 1{X₍₁₎ ≤ u < X₍ₙ₎} du, so W² counts pairs s < t with
 * X₍₁₎ ≤ s and X₍ₙ₎ > t, whose probability is the integrand.
 *
 * Grid choices: outside ±8.5 the normal CDF is 0 or 1 in double precision, so both integrands
 * vanish there. In s the integrand is smooth and decays like a Gaussian, where the plain trapezoid
 * rule converges geometrically; in the gap w = t − s ≥ 0 it starts at a non-zero value, so
 * Simpson's rule is used there. Step 0.05 gives agreement with the exact n = 2, 3 values to ~1e-10.
 */

const HALF_WIDTH = 8.5;
const STEP = 0.05;

let cdfGrid: Float64Array | undefined;

/** Φ on the integration grid, computed once: the integrals for every n reuse it. */
function grid(): Float64Array {
  if (cdfGrid === undefined) {
    const count = Math.round((2 * HALF_WIDTH) / STEP) + 1;
    cdfGrid = new Float64Array(count);
    for (let k = 0; k < count; k++) cdfGrid[k] = normalCdf(-HALF_WIDTH + k * STEP);
  }
  return cdfGrid;
}

export interface RangeMoments {
  /** E[W], the mean range of n standard normals */
  d2: number;
  /** sd[W], the standard deviation of that range */
  d3: number;
}

/** d₂(n) and d₃(n) for n ≥ 2 by the integrals above (ASTM E2587 definitions). */
export function rangeMoments(n: number): RangeMoments {
  const F = grid();
  const count = F.length;

  let mean = 0;
  for (let k = 0; k < count; k++) mean += 1 - F[k] ** n - (1 - F[k]) ** n;
  mean *= STEP;

  // w-direction Simpson weights 1, 4, 2, 4, …; points with t beyond the grid contribute zero.
  let secondMoment = 0;
  for (let i = 0; i < count; i++) {
    const lowerSurvival = (1 - F[i]) ** n;
    let inner = 0;
    for (let j = 0; i + j < count; j++) {
      const Ft = F[i + j];
      const value = 1 - Ft ** n - lowerSurvival + (Ft - F[i]) ** n;
      inner += (j === 0 ? 1 : j % 2 === 1 ? 4 : 2) * value;
    }
    secondMoment += inner;
  }
  secondMoment *= 2 * STEP * (STEP / 3);

  return { d2: mean, d3: Math.sqrt(secondMoment - mean * mean) };
}
