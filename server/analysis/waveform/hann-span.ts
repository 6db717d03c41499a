/**
 * The whole-cycle span of a record and its Hann weights (IEC 61000-4-7: harmonics are evaluated
 * over an integer number of fundamental cycles).
 *
 * Why Hann weights: a test stand rarely samples a whole number of cycles, so the whole-cycle
 * span usually ends between two samples. A plain (rectangular) sum then leaks about
 * (half a sample)/(span length) of the fundamental into every harmonic. The Hann window is zero
 * with zero slope at both ends, so a weighted sum over the samples converges to the continuous
 * whole-cycle integral however the span meets the sample grid, and its spectrum is zero at every
 * whole number of cycles-per-span from 2 up (Harris 1978, Proc. IEEE 66(1), Hann window). Over
 * M ≥ 2 whole cycles, harmonic h therefore sees nothing of DC, of any other harmonic k (which
 * sits |h − k|·M ≥ 2 bins away) or of the negative-frequency images.
 */

/** Hann weights over a span that may start and end between samples. */
export interface HannSpan {
  /** Index of the first sample inside the span. */
  first: number;
  /** Weight of each sample from `first` on. */
  weights: Float64Array;
  weightSum: number;
}

// The weights come from a rotating phasor, reseeded from Math.cos/sin this often so that
// rounding cannot accumulate.
const RESEED_SAMPLES = 1024;

/**
 * Hann weights w = sin²(π(n − start)/span) = (1 − cos(2π(n − start)/span))/2 for the sample
 * positions start ≤ n ≤ start + span (Harris 1978), clipped to the record.
 */
export function hannSpan(startSample: number, spanSamples: number, recordLength: number): HannSpan {
  const first = Math.max(0, Math.ceil(startSample));
  const last = Math.min(recordLength - 1, Math.floor(startSample + spanSamples));
  const weights = new Float64Array(Math.max(0, last - first + 1));
  const step = (2 * Math.PI) / spanSamples;
  const cs = Math.cos(step);
  const ss = Math.sin(step);
  let weightSum = 0;
  for (let block = 0; block < weights.length; block += RESEED_SAMPLES) {
    const angle = step * (first + block - startSample);
    let c = Math.cos(angle);
    let s = Math.sin(angle);
    const end = Math.min(weights.length, block + RESEED_SAMPLES);
    for (let i = block; i < end; i++) {
      const w = 0.5 - 0.5 * c;
      weights[i] = w;
      weightSum += w;
      const next = c * cs - s * ss;
      s = c * ss + s * cs;
      c = next;
    }
  }
  return { first, weights, weightSum };
}

/** Levels of one signal over the span. */
export interface SpanLevels {
  dcV: number;
  rmsV: number;
  peakV: number;
}

/**
 * DC level and true RMS about it as Hann-weighted means over the whole-cycle span: for a
 * periodic signal the Hann-weighted means of x and of x² equal the plain whole-cycle means (the
 * window's spectrum is zero at every multiple of the cycle count from 2 up, Harris 1978), yet do
 * not depend on where the span meets the sample grid. The peak is the largest |x − DC| of the
 * samples inside the span.
 */
export function spanLevels(x: Float64Array, span: HannSpan): SpanLevels {
  const { first, weights, weightSum } = span;
  // Sums are taken about the first sample, which lies within the waveform's own swing of DC, so
  // the mean square minus the squared mean loses no precision even under a large offset.
  const reference = x[first];
  let sum = 0;
  let squares = 0;
  let lowest = 0;
  let highest = 0;
  for (let i = 0; i < weights.length; i++) {
    const d = x[first + i] - reference;
    const wd = weights[i] * d;
    sum += wd;
    squares += wd * d;
    // Math.min/max compile to branch-free instructions; comparisons here cost three times more.
    lowest = Math.min(lowest, d);
    highest = Math.max(highest, d);
  }
  const dcAboveReference = sum / weightSum;
  const meanSquare = squares / weightSum - dcAboveReference * dcAboveReference;
  return {
    dcV: reference + dcAboveReference,
    rmsV: Math.sqrt(Math.max(0, meanSquare)),
    peakV: Math.max(highest - dcAboveReference, dcAboveReference - lowest),
  };
}
