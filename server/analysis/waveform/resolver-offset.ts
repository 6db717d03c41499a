import { DEG_PER_RAD, wrapDegrees180 } from './angles.js';
import { measureFundamentalHz, wholeCyclesIn } from './fundamental-frequency.js';
import { requirePositive, requirePositiveInteger, requireSameLength, toFiniteSamples, type Samples } from './validate.js';
import { harmonicPhasors } from './goertzel.js';
import { hannSpan, spanLevels } from './hann-span.js';

/** The uv back-EMF in volts and the R/D converter's angle, sampled together at sampleRateHz. */
export interface ResolverOffsetInput {
  sampleRateHz: number;
  polePairs: number;
  resolverPolePairs: number;
  backEmfUvV: Samples;
  resolverAngleDeg: Samples;
}

/** Offset and its peak-to-peak spread, in motor electrical degrees (see resolverOffset). */
export interface ResolverOffset {
  offsetDeg: number;
  spreadDeg: number;
}

// The resolver must turn at the back-EMF's electrical speed (after the pole-pair ratio); a
// different rate means a wrong ratio, a reversed resolver or a stalled reading, not an offset.
const SPEED_RATIO_TOLERANCE = 0.05;

/**
 * Resolver offset: the electrical angle between the resolver's zero and the rotor's magnetic axis.
 *
 * Convention: the rotor's electrical angle θ is 0 where the U-phase line-to-neutral back-EMF
 * crosses zero going positive, so the line-to-line voltage uv leads it by 30°
 * (u_uv ∝ sin(θ + 30°)). `resolverAngleDeg` is the resolver-to-digital converter's output in
 * resolver electrical degrees, sampled together with `backEmfUvV`; in motor electrical degrees
 * the resolver reads resolverAngleDeg × polePairs / resolverPolePairs, and polePairs must be a
 * whole multiple of resolverPolePairs. offsetDeg = resolver angle − θ, wrapped to (−180°, 180°].
 * spreadDeg is the peak-to-peak of that difference over the record, about its mean: a wobble
 * means a loose or eccentric resolver; with a clean mounting it is only the noise of the two
 * readings (peak-to-peak of Gaussian noise grows with record length, about 6–8 σ for 10⁴–10⁶
 * samples, common practice).
 *
 * Method (DOMAIN resolver section: a least-squares/DFT phase estimate, not a single zero
 * crossing): the uv fundamental's frequency and phase are measured over the largest whole
 * number of cycles (Hann-weighted single-frequency DFT, IEC 61000-4-7 whole-cycle principle),
 * giving θ(t) = 2π·f·t + φ − 30° for uv ∝ sin(2π·f·t + φ); the offset is the circular mean of
 * resolver − θ over every sample. Because the pole-pair ratio is a whole number, multiplying a
 * wrapped resolver reading by it is exact modulo 360°, so the difference needs no unwrapping.
 * The record needs at least 8 samples per electrical cycle (spectrum-peak.ts).
 */
export function resolverOffset(input: ResolverOffsetInput): ResolverOffset {
  const sampleRateHz = requirePositive('sampleRateHz', input.sampleRateHz);
  const polePairs = requirePositiveInteger('polePairs', input.polePairs);
  const resolverPolePairs = requirePositiveInteger('resolverPolePairs', input.resolverPolePairs);
  if (polePairs % resolverPolePairs !== 0) {
    throw new Error(
      `resolverPolePairs must divide polePairs (${polePairs}) so the angle ratio is a whole number, got ${resolverPolePairs}`,
    );
  }
  const ratio = polePairs / resolverPolePairs;
  const uv = toFiniteSamples('backEmfUvV', input.backEmfUvV);
  const resolverDeg = toFiniteSamples('resolverAngleDeg', input.resolverAngleDeg);
  requireSameLength([['backEmfUvV', uv], ['resolverAngleDeg', resolverDeg]]);

  const electricalHz = measureFundamentalHz(uv, sampleRateHz, 'backEmfUvV');
  const cycles = wholeCyclesIn(uv.length, sampleRateHz, electricalHz);
  if (cycles < 2) {
    throw new Error(`backEmfUvV must hold at least two electrical cycles, got ${cycles}`);
  }
  const omega = (2 * Math.PI * electricalHz) / sampleRateHz;
  requireMatchingSpeed(resolverDeg, ratio, omega);

  const span = hannSpan(0, (cycles * 2 * Math.PI) / omega, uv.length);
  const fundamental = harmonicPhasors(uv, span, spanLevels(uv, span).dcV, omega, 1);
  // uv = A·cos(ω·n + φc) = A·sin(ω·n + φc + 90°) and uv ∝ sin(θ + 30°), so θ(n) = ω·n + φc + 60°.
  const thetaAtZeroDeg = Math.atan2(fundamental.im[1], fundamental.re[1]) * DEG_PER_RAD + 60;
  const degPerSample = omega * DEG_PER_RAD;
  const differenceDeg = (n: number): number =>
    wrapDegrees180(resolverDeg[n] * ratio - (thetaAtZeroDeg + degPerSample * n));

  let sumCos = 0;
  let sumSin = 0;
  for (let n = 0; n < uv.length; n++) {
    const d = differenceDeg(n) / DEG_PER_RAD;
    sumCos += Math.cos(d);
    sumSin += Math.sin(d);
  }
  const offsetDeg = wrapDegrees180(Math.atan2(sumSin, sumCos) * DEG_PER_RAD);
  let lowest = Infinity;
  let highest = -Infinity;
  for (let n = 0; n < uv.length; n++) {
    const deviation = wrapDegrees180(differenceDeg(n) - offsetDeg);
    lowest = Math.min(lowest, deviation);
    highest = Math.max(highest, deviation);
  }
  return { offsetDeg, spreadDeg: highest - lowest };
}

/**
 * Compares the resolver's unwrapped advance over the record, in motor electrical degrees, with
 * the back-EMF's; unwrapping assumes under 180° of resolver angle between samples.
 */
function requireMatchingSpeed(resolverDeg: Float64Array, ratio: number, omegaRadPerSample: number): void {
  let advanceDeg = 0;
  for (let n = 1; n < resolverDeg.length; n++) {
    advanceDeg += wrapDegrees180(resolverDeg[n] - resolverDeg[n - 1]);
  }
  const speedRatio = (advanceDeg * ratio) / (omegaRadPerSample * DEG_PER_RAD * (resolverDeg.length - 1));
  if (Math.abs(speedRatio - 1) > SPEED_RATIO_TOLERANCE) {
    throw new Error(
      `resolverAngleDeg must advance with the back-EMF (motor electrical speed ratio 1), got ${speedRatio.toFixed(3)}: check the pole pairs and the resolver's direction`,
    );
  }
}
