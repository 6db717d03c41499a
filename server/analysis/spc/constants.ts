import { rangeMoments } from './rangeMoments.js';
import { requireIntegerInRange } from './validate.js';

/**
 * Control-chart constants computed from their definitions (ASTM E2587; ASTM MNL 7;
 * NIST/SEMATECH e-Handbook §6.3.2) rather than copied from a printed table, because printed
 * tables round differently in the third decimal.
 */

export const MIN_SUBGROUP_SIZE = 2;
export const MAX_SUBGROUP_SIZE = 25;

export interface ControlChartConstants {
  A2: number;
  A3: number;
  d2: number;
  d3: number;
  c4: number;
  B3: number;
  B4: number;
  D3: number;
  D4: number;
}

/**
 * c₄(n) = √(2/(n−1))·Γ(n/2)/Γ((n−1)/2), the mean of the sample standard deviation of n standard
 * normals (ASTM E2587). The gamma ratio r(n) is evaluated exactly from Γ(1) = 1, Γ(½) = √π and
 * Γ(x+1) = x·Γ(x), which give r(2) = 1/√π, r(3) = √π/2 and r(n+2) = r(n)·n/(n−1); the ratio never
 * overflows, so any n ≥ 2 works (pooled standard deviations need c₄ of many degrees of freedom).
 */
export function c4(n: number): number {
  if (!Number.isInteger(n) || n < 2) throw new Error(`n must be an integer ≥ 2, got ${String(n)}`);
  let ratio = n % 2 === 0 ? 1 / Math.sqrt(Math.PI) : Math.sqrt(Math.PI) / 2;
  for (let m = n % 2 === 0 ? 2 : 3; m < n; m += 2) ratio *= m / (m - 1);
  return Math.sqrt(2 / (n - 1)) * ratio;
}

const cache = new Map<number, Readonly<ControlChartConstants>>();

function compute(n: number): ControlChartConstants {
  const { d2, d3 } = rangeMoments(n);
  const c = c4(n);
  const sdOfS = Math.sqrt(1 - c * c) / c;
  return {
    A2: 3 / (d2 * Math.sqrt(n)),
    A3: 3 / (c * Math.sqrt(n)),
    d2,
    d3,
    c4: c,
    B3: Math.max(0, 1 - 3 * sdOfS),
    B4: 1 + 3 * sdOfS,
    D3: Math.max(0, 1 - (3 * d3) / d2),
    D4: 1 + (3 * d3) / d2,
  };
}

/**
 * Shewhart chart factors for subgroup size n = 2…25 (ASTM E2587; NIST/SEMATECH §6.3.2):
 * A₂ = 3/(d₂√n), A₃ = 3/(c₄√n), D₃,₄ = max(0, 1 ∓ 3d₃/d₂), B₃,₄ = max(0, 1 ∓ 3√(1−c₄²)/c₄),
 * with d₂, d₃ from the range integrals and c₄ from gamma functions. Computed once per n, then cached.
 */
export function controlChartConstants(n: number): Readonly<ControlChartConstants> {
  requireIntegerInRange('n (subgroup size)', n, MIN_SUBGROUP_SIZE, MAX_SUBGROUP_SIZE);
  let constants = cache.get(n);
  if (constants === undefined) {
    constants = Object.freeze(compute(n));
    cache.set(n, constants);
  }
  return constants;
}
