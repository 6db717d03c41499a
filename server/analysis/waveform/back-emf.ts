import { DEG_PER_RAD, wrapDegrees360 } from './angles.js';
import { loudest, measureFundamentalHz, wholeCyclesIn } from './fundamental-frequency.js';
import { harmonicPhasors } from './goertzel.js';
import { hannSpan, spanLevels } from './hann-span.js';
import { requirePositive, requirePositiveInteger, requireSameLength, toFiniteSamples, type Samples } from './validate.js';

/** Highest harmonic evaluated: the output is keyed 2…25 (IEC 61000-2-2 would go to the 40th). */
export const HIGHEST_HARMONIC = 25;

/** One value per line-to-line voltage. */
export interface PerLine<T> {
  uv: T;
  vw: T;
  wu: T;
}

/** One open-circuit spin: line-to-line voltages in volts, sampled together at sampleRateHz. */
export interface BackEmfInput {
  sampleRateHz: number;
  speedRpm: number;
  /** Declared pole pairs; the frequency is measured, so compare with `polePairsFromFrequency`. */
  polePairs: number;
  lineToLineV: PerLine<Samples>;
}

/** Results of analyzeBackEmf; units are in the names, harmonics keyed by order 2…25. */
export interface BackEmfAnalysis {
  electricalHz: number;
  polePairsFromFrequency: number;
  cycles: number;
  rmsV: PerLine<number>;
  peakV: PerLine<number>;
  keVPerKrpm: number;
  thdPercent: PerLine<number>;
  harmonicsPercent: PerLine<Record<number, number>>;
  unbalancePercent: number;
  phaseSpacingDeg: { uvToVw: number; vwToWu: number; wuToUv: number };
  sequence: 'UVW' | 'UWV';
}

const LINES = ['uv', 'vw', 'wu'] as const;

/**
 * Back-EMF analysis of the three line-to-line voltages of an open-circuit spin test.
 *
 * - electricalHz: measured on the loudest line (fundamental-frequency.ts), not taken from p·n/60;
 *   polePairsFromFrequency = round(60·f/n) (f = p·n/60, common practice).
 * - Harmonics: Hann-weighted single-frequency DFT at exact multiples of the measured frequency
 *   over the largest whole number of cycles in the record (IEC 61000-4-7 whole-cycle principle;
 *   hann-span.ts says why the weights make a span that ends between samples exact).
 * - rmsV: true RMS about DC over those whole cycles; peakV: largest |v − DC| in them.
 * - keVPerKrpm: mean of the three fundamental line-to-line RMS values per 1000 rpm.
 * - thdPercent: IEEE Std 519-2014, 100·√(Σ V_h²)/V₁ with h = 2…25, the orders reported in
 *   harmonicsPercent (IEC 61000-2-2 sums to the 40th).
 * - unbalancePercent: NEMA MG 1, largest deviation of the fundamental RMS values from their mean,
 *   over the mean.
 * - phaseSpacingDeg: how far each line's fundamental lags the previous one, in (0°, 360°);
 *   sequence is UVW when vw lags uv by less than 180° (about 120° in a healthy machine).
 */
export function analyzeBackEmf(input: BackEmfInput): BackEmfAnalysis {
  const sampleRateHz = requirePositive('sampleRateHz', input.sampleRateHz);
  const speedRpm = requirePositive('speedRpm', input.speedRpm);
  requirePositiveInteger('polePairs', input.polePairs);
  if (typeof input.lineToLineV !== 'object' || input.lineToLineV === null) {
    throw new Error('lineToLineV must hold the uv, vw and wu sample arrays');
  }
  const signals = LINES.map((line) => toFiniteSamples(`lineToLineV.${line}`, input.lineToLineV[line]));
  requireSameLength(LINES.map((line, i) => [`lineToLineV.${line}`, signals[i]] as const));

  const electricalHz = measureFundamentalHz(loudest(signals), sampleRateHz, 'lineToLineV');
  if (HIGHEST_HARMONIC * electricalHz >= sampleRateHz / 2) {
    throw new Error(
      `sampleRateHz must exceed ${2 * HIGHEST_HARMONIC} × the ${electricalHz.toFixed(2)} Hz fundamental so its ${HIGHEST_HARMONIC}th harmonic lies below Nyquist, got ${sampleRateHz}`,
    );
  }
  const cycles = wholeCyclesIn(signals[0].length, sampleRateHz, electricalHz);
  if (cycles < 2) {
    throw new Error(`lineToLineV must hold at least two electrical cycles, got ${cycles} of ${electricalHz.toFixed(2)} Hz`);
  }
  const samplesPerCycle = sampleRateHz / electricalHz;
  const span = hannSpan(0, cycles * samplesPerCycle, signals[0].length);
  const levels = signals.map((x) => spanLevels(x, span));
  const phasors = signals.map((x, i) =>
    harmonicPhasors(x, span, levels[i].dcV, (2 * Math.PI) / samplesPerCycle, HIGHEST_HARMONIC),
  );
  const amplitudes = phasors.map((p) => p.re.map((re, order) => Math.hypot(re, p.im[order])));
  const fundamentalRmsV = amplitudes.map((a) => a[1] / Math.SQRT2);
  const phaseDeg = phasors.map((p) => Math.atan2(p.im[1], p.re[1]) * DEG_PER_RAD);
  const lagDeg = (from: number, to: number): number => wrapDegrees360(phaseDeg[from] - phaseDeg[to]);
  const perLine = <T>(value: (i: number) => T): PerLine<T> => ({ uv: value(0), vw: value(1), wu: value(2) });

  const phaseSpacingDeg = { uvToVw: lagDeg(0, 1), vwToWu: lagDeg(1, 2), wuToUv: lagDeg(2, 0) };
  return {
    electricalHz,
    polePairsFromFrequency: Math.round((60 * electricalHz) / speedRpm),
    cycles,
    rmsV: perLine((i) => levels[i].rmsV),
    peakV: perLine((i) => levels[i].peakV),
    keVPerKrpm: mean(fundamentalRmsV) / (speedRpm / 1000),
    thdPercent: perLine((i) => thdPercentOf(amplitudes[i])),
    harmonicsPercent: perLine((i) => harmonicsPercentOf(amplitudes[i])),
    unbalancePercent: largestDeviationPercent(fundamentalRmsV),
    phaseSpacingDeg,
    sequence: phaseSpacingDeg.uvToVw < 180 ? 'UVW' : 'UWV',
  };
}

/** IEEE Std 519-2014: THD = 100·√(Σ_{h=2…25} V_h²)/V₁; amplitudes are indexed by order. */
function thdPercentOf(amplitudes: Float64Array): number {
  let squares = 0;
  for (let order = 2; order <= HIGHEST_HARMONIC; order++) squares += amplitudes[order] ** 2;
  return (100 * Math.sqrt(squares)) / amplitudes[1];
}

function harmonicsPercentOf(amplitudes: Float64Array): Record<number, number> {
  const percent: Record<number, number> = {};
  for (let order = 2; order <= HIGHEST_HARMONIC; order++) {
    percent[order] = (100 * amplitudes[order]) / amplitudes[1];
  }
  return percent;
}

/** NEMA MG 1 unbalance: 100 × largest deviation from the mean / mean (not (max − min)/mean). */
function largestDeviationPercent(values: readonly number[]): number {
  const average = mean(values);
  return (100 * Math.max(...values.map((v) => Math.abs(v - average)))) / average;
}

function mean(values: readonly number[]): number {
  return values.reduce((sum, v) => sum + v, 0) / values.length;
}
