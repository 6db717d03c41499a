import { coarseSpectrumPeakHz } from './spectrum-peak.js';
import { hannSpan, harmonicPhasors } from './whole-cycle-dft.js';

const MAX_REFINEMENTS = 12;
// Far fewer samples cannot carry two cycles with harmonics to the 25th; this only guards the FFT.
const MIN_SAMPLES = 16;
const CONVERGED_RELATIVE = 1e-12;

/**
 * Whole cycles of `frequencyHz` that fit in `recordLength` samples. The small allowance keeps a
 * record of exactly k cycles (coherent sampling) at k despite rounding in the frequency.
 */
export function wholeCyclesIn(recordLength: number, sampleRateHz: number, frequencyHz: number): number {
  return Math.floor((recordLength * frequencyHz) / sampleRateHz + 1e-9);
}

/**
 * Fundamental frequency shared by the signals, in Hz, measured without assuming coherent
 * sampling. Method: coarse Hann-FFT peak (spectrum-peak.ts), then phase-difference refinement:
 * the fundamental's phase is taken by a Hann-weighted single-frequency DFT over a segment of
 * whole cycles at the start of the record and over the same number of cycles K whole cycles
 * later; the phase advance between them, Δφ = 2π·K·Δf/f, corrects the frequency. Because the two
 * segments are exactly K cycles apart, at the true frequency they hold the same waveform, so
 * harmonics, DC and noise-free leakage cancel from Δφ and the iteration settles on the true
 * frequency (the IEC 61000-4-7 whole-cycle principle applied to the estimate itself).
 * Phase advances of several signals are combined weighted by their squared amplitudes.
 */
export function measureFundamentalHz(
  signals: readonly Float64Array[],
  sampleRateHz: number,
  name: string,
): number {
  const recordLength = signals[0].length;
  if (recordLength < MIN_SAMPLES) {
    throw new Error(`${name} must hold at least ${MIN_SAMPLES} samples, got ${recordLength}`);
  }
  let frequencyHz = coarseSpectrumPeakHz(loudest(signals), sampleRateHz, name);
  for (let pass = 0; pass < MAX_REFINEMENTS; pass++) {
    const cycles = (recordLength * frequencyHz) / sampleRateHz;
    const whole = Math.floor(cycles);
    // A record just short of two estimated cycles still gets a refinement step; the caller then
    // rejects it if it really holds fewer than two.
    const segmentCycles = whole >= 2 ? Math.floor(whole / 2) : cycles / 2;
    const shiftCycles = whole >= 2 ? whole - segmentCycles : cycles / 2;
    const samplesPerCycle = sampleRateHz / frequencyHz;
    const omega = (2 * Math.PI) / samplesPerCycle;
    const early = harmonicPhasors(signals, hannSpan(0, segmentCycles * samplesPerCycle, recordLength), omega, 1);
    const late = harmonicPhasors(
      signals,
      hannSpan(shiftCycles * samplesPerCycle, segmentCycles * samplesPerCycle, recordLength),
      omega,
      1,
    );
    let re = 0;
    let im = 0;
    for (let k = 0; k < signals.length; k++) {
      // late × conj(early): its angle is the phase advance, its size the amplitude² weight.
      re += late[k].re[1] * early[k].re[1] + late[k].im[1] * early[k].im[1];
      im += late[k].im[1] * early[k].re[1] - late[k].re[1] * early[k].im[1];
    }
    const stepHz = (Math.atan2(im, re) * frequencyHz) / (2 * Math.PI * shiftCycles);
    frequencyHz += stepHz;
    if (!(frequencyHz > 0)) {
      throw new Error(`${name} shows no stable fundamental frequency`);
    }
    if (Math.abs(stepHz) <= CONVERGED_RELATIVE * frequencyHz) break;
  }
  return frequencyHz;
}

/** The signal with the largest variance: a dead or open line must not steer the coarse search. */
function loudest(signals: readonly Float64Array[]): Float64Array {
  let best = signals[0];
  let bestVariance = -1;
  for (const x of signals) {
    let sum = 0;
    let squares = 0;
    for (let i = 0; i < x.length; i++) {
      sum += x[i];
      squares += x[i] * x[i];
    }
    const variance = squares / x.length - (sum / x.length) ** 2;
    if (variance > bestVariance) {
      best = x;
      bestVariance = variance;
    }
  }
  return best;
}
