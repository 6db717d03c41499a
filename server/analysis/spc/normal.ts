/**
 * The standard normal distribution function, built on the complementary error function so that
 * both tails keep full relative precision (ppm estimates and the Anderson–Darling statistic live
 * in the tails, where 1 − Φ(x) computed by subtraction would lose every digit).
 *
 * Method: Abramowitz & Stegun (1964) 7.1.6, the all-positive series for erf, below x = 2, and
 * A&S 7.1.14, the continued fraction for erfc, from x = 2 on (evaluated with the modified Lentz
 * algorithm, Press et al., Numerical Recipes 3rd ed. §5.2). Both are accurate to a few units in
 * the last place in their ranges.
 */

const SQRT_PI = Math.sqrt(Math.PI);
const SERIES_LIMIT = 2;
const EPSILON = 1e-16;
const MAX_TERMS = 500;

/** erf(x) for 0 ≤ x < 2 by A&S 7.1.6: (2/√π)·e^{−x²}·Σ 2ⁿx^{2n+1}/(1·3···(2n+1)). */
function erfSeries(x: number): number {
  const twoXSquared = 2 * x * x;
  let term = x;
  let sum = x;
  for (let n = 1; n < MAX_TERMS && term > EPSILON * sum; n++) {
    term *= twoXSquared / (2 * n + 1);
    sum += term;
  }
  return (2 / SQRT_PI) * Math.exp(-x * x) * sum;
}

/**
 * The continued fraction of A&S 7.1.14 for x ≥ 2: erfc(x) = e^{−x²}/(√π·K) with
 * K = x + (1/2)/(x + 1/(x + (3/2)/(x + …))). Returned as K so callers can take logs safely.
 */
function erfcContinuedFraction(x: number): number {
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let j = 1; j < MAX_TERMS; j++) {
    const a = j / 2;
    d = x + a * d;
    if (d === 0) d = tiny;
    c = x + a / c;
    if (c === 0) c = tiny;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < EPSILON) break;
  }
  return f;
}

/** ln erfc(x) for x ≥ 0, finite even where erfc(x) itself underflows. */
function logErfc(x: number): number {
  if (x < SERIES_LIMIT) return Math.log(1 - erfSeries(x));
  return -x * x - Math.log(SQRT_PI * erfcContinuedFraction(x));
}

/** ln Φ(x), finite for any finite x, from the identity Φ(x) = ½·erfc(−x/√2) (A&S ch. 26). */
export function logNormalCdf(x: number): number {
  if (Number.isNaN(x)) throw new Error('x must be a number, got NaN');
  if (x === Infinity) return 0;
  if (x === -Infinity) return -Infinity;
  const t = x / Math.SQRT2;
  if (t <= 0) return Math.log(0.5) + logErfc(-t);
  return Math.log1p(-0.5 * Math.exp(logErfc(t)));
}

/**
 * Standard normal CDF Φ(x) = ½·erfc(−x/√2) (A&S ch. 26), with erfc from A&S 7.1.6 / 7.1.14;
 * relative precision is kept in the lower tail, so Φ(−x) is the accurate upper-tail probability.
 */
export function normalCdf(x: number): number {
  return Math.exp(logNormalCdf(x));
}

/** z₀.₉₇₅ = Φ⁻¹(0.975), the two-sided 95 % standard normal quantile (A&S ch. 26; checked against jstat). */
export const Z_975 = 1.959963984540054;
