import { harmonicPhasors } from './goertzel.js';
import { hannSpan } from './hann-span.js';
import { coarseSpectrumPeakHz } from './spectrum-peak.js';

const MAX_REFINEMENTS = 12;
// The precision comes from the distance between the two segments more than from their length,
// so long records use short segments at either end and the refinement reads a fraction of them.
const MAX_SEGMENT_CYCLES = 8;
// Each pass shrinks the error by orders of magnitude, so once a correction is this small the
// corrected value is already exact to rounding; stopping here saves a pass.
const LAST_STEP_RELATIVE = 1e-9;
const RANKING_SAMPLES = 8192;
// Far fewer samples cannot carry two cycles with harmonics to the 25th; this only guards the FFT.
const MIN_SAMPLES = 16;

/**
 * Whole cycles of `frequencyHz` that fit in `recordLength` samples. The small allowance keeps a
 * record of exactly k cycles (coherent sampling) at k despite rounding in the frequency.
 */
export function wholeCyclesIn(recordLength: number, sampleRateHz: number, frequencyHz: number): number {
  return Math.floor((recordLength * frequencyHz) / sampleRateHz + 1e-9);
}

/**
 * Fundamental frequency of a record, in Hz, measured without assuming coherent sampling.
 * Method: coarse Hann-FFT peak (spectrum-peak.ts), then phase-difference refinement: the
 * fundamental's phase is taken by a Hann-weighted single-frequency DFT over a segment of whole
 * cycles (at most 8) at the start of the record and over as many cycles K whole cycles later,
 * at the end of the record's whole cycles; the phase
 * advance between them, Δφ = 2π·K·Δf/f, corrects the frequency. Because the two segments are
 * exactly K cycles apart, at the true frequency they hold the same waveform, so harmonics and DC
 * leave Δφ untouched and the iteration settles on the true frequency (the IEC 61000-4-7
 * whole-cycle principle applied to the estimate itself). Two passes usually suffice.
 */
export function measureFundamentalHz(x: Float64Array, sampleRateHz: number, name: string): number {
  if (x.length < MIN_SAMPLES) {
    throw new Error(`${name} must hold at least ${MIN_SAMPLES} samples, got ${x.length}`);
  }
  let frequencyHz = coarseSpectrumPeakHz(x, sampleRateHz, name);
  // The record mean is DC to within a fraction of a cycle's worth of the waveform; removing it
  // keeps a large offset out of the segment phases (see harmonicPhasors).
  let sumV = 0;
  for (let i = 0; i < x.length; i++) sumV += x[i];
  const meanV = sumV / x.length;
  for (let pass = 0; pass < MAX_REFINEMENTS; pass++) {
    const cycles = (x.length * frequencyHz) / sampleRateHz;
    const whole = Math.floor(cycles);
    // A record just short of two estimated cycles still gets a refinement step; the caller then
    // rejects it if it really holds fewer than two.
    const segmentCycles = whole >= 2 ? Math.min(MAX_SEGMENT_CYCLES, Math.floor(whole / 2)) : cycles / 2;
    const shiftCycles = whole >= 2 ? whole - segmentCycles : cycles / 2;
    const samplesPerCycle = sampleRateHz / frequencyHz;
    const omega = (2 * Math.PI) / samplesPerCycle;
    const phaseAt = (startCycles: number): [number, number] => {
      const span = hannSpan(startCycles * samplesPerCycle, segmentCycles * samplesPerCycle, x.length);
      const { re, im } = harmonicPhasors(x, span, meanV, omega, 1);
      return [re[1], im[1]];
    };
    const [earlyRe, earlyIm] = phaseAt(0);
    const [lateRe, lateIm] = phaseAt(shiftCycles);
    // angle of late × conj(early) is the phase advance
    const advanceRad = Math.atan2(lateIm * earlyRe - lateRe * earlyIm, lateRe * earlyRe + lateIm * earlyIm);
    const stepHz = (advanceRad * frequencyHz) / (2 * Math.PI * shiftCycles);
    frequencyHz += stepHz;
    if (!(frequencyHz > 0)) {
      throw new Error(`${name} shows no stable fundamental frequency`);
    }
    if (Math.abs(stepHz) <= LAST_STEP_RELATIVE * frequencyHz) break;
  }
  return frequencyHz;
}

/**
 * The line with the largest variance: the frequency is measured on it so that a dead or open
 * line cannot steer the measurement. Every stride-th sample is enough to rank the lines.
 */
export function loudest(signals: readonly Float64Array[]): Float64Array {
  const stride = Math.max(1, Math.floor(signals[0].length / RANKING_SAMPLES));
  let best = signals[0];
  let bestVariance = -1;
  for (const x of signals) {
    let count = 0;
    let sum = 0;
    let squares = 0;
    for (let i = 0; i < x.length; i += stride) {
      const d = x[i] - x[0];
      sum += d;
      squares += d * d;
      count++;
    }
    const variance = squares / count - (sum / count) ** 2;
    if (variance > bestVariance) {
      best = x;
      bestVariance = variance;
    }
  }
  return best;
}
