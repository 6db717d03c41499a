/**
 * Single-frequency DFTs over a whole number of fundamental cycles (IEC 61000-4-7: harmonics are
 * evaluated over an integer number of cycles), weighted by a Hann window spanning exactly those
 * cycles.
 *
 * Why the Hann weights: a test stand rarely samples a whole number of cycles, so the whole-cycle
 * span usually ends between two samples. A plain (rectangular) sum then leaks about
 * (half a sample)/(span length) of the fundamental into every harmonic. The Hann window is zero
 * with zero slope at both ends, so the sampled sum converges to the continuous whole-cycle
 * integral however the span meets the sample grid, and its spectrum is zero at every whole
 * number of cycles-per-span from 2 up (Harris 1978, Proc. IEEE 66(1), Hann window). Over M ≥ 2
 * whole cycles, harmonic h therefore sees nothing of DC, of any other harmonic k (which sit
 * |h − k|·M ≥ 2 bins away) or of the negative-frequency images.
 */

/** Hann weights over a span that may start and end between samples. */
export interface HannSpan {
  /** Index of the first sample inside the span. */
  first: number;
  /** Weight of each sample from `first` on. */
  weights: Float64Array;
  weightSum: number;
}

/** Complex amplitudes by harmonic order: index h holds order h (index 0 is not used). */
export interface HarmonicPhasors {
  re: Float64Array;
  im: Float64Array;
}

// The Hann weights come from a rotating phasor, reseeded from Math.cos/sin this often so that
// rounding cannot accumulate.
const RESEED_SAMPLES = 1024;

/**
 * Hann weights w = sin²(π(n − start)/span) over sample positions start ≤ n ≤ start + span
 * (Harris 1978), clipped to the record.
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
      const w = 0.5 - 0.5 * c; // sin²(x/2) = (1 − cos x)/2
      weights[i] = w;
      weightSum += w;
      const next = c * cs - s * ss;
      s = c * ss + s * cs;
      c = next;
    }
  }
  return { first, weights, weightSum };
}

/**
 * Complex amplitudes c_h = 2·Σ w·x·e^(−j·h·ω·n) / Σ w of orders 1…highestOrder for each signal,
 * with n counted from the first sample of the record: a component A·cos(h·ω·n + φ) gives
 * c_h = A·e^(jφ). Each sum is a Goertzel recursion (Goertzel 1958, Amer. Math. Monthly 65(1)),
 * one multiply per sample and order instead of a complex rotation.
 */
export function harmonicPhasors(
  signals: readonly Float64Array[],
  span: HannSpan,
  omegaRadPerSample: number,
  highestOrder: number,
): HarmonicPhasors[] {
  const phasors = signals.map(() => ({
    re: new Float64Array(highestOrder + 1),
    im: new Float64Array(highestOrder + 1),
  }));
  const jobs: Array<{ signal: number; order: number }> = [];
  signals.forEach((_, signal) => {
    for (let order = 1; order <= highestOrder; order++) jobs.push({ signal, order });
  });
  const last = span.first + span.weights.length - 1;
  const scale = 2 / span.weightSum;
  const states = new Float64Array(2 * LANES);
  for (let start = 0; start < jobs.length; start += LANES) {
    // A short last group repeats its final job in the idle lanes.
    const group = Array.from({ length: LANES }, (_, lane) => jobs[Math.min(start + lane, jobs.length - 1)]);
    const omegas = group.map(({ order }) => order * omegaRadPerSample);
    goertzelLanes(
      group.map(({ signal }) => signals[signal]),
      span,
      Float64Array.from(omegas, (omega) => 2 * Math.cos(omega)),
      states,
    );
    for (let lane = 0; lane < Math.min(LANES, jobs.length - start); lane++) {
      const { signal, order } = group[lane];
      const omega = omegas[lane];
      // s₁ − e^(−jω)·s₂ = Σ y[i]·e^(jω(L−1−i)); rotate it back to the record's first sample.
      const yRe = states[2 * lane] - Math.cos(omega) * states[2 * lane + 1];
      const yIm = Math.sin(omega) * states[2 * lane + 1];
      const c = Math.cos(omega * last);
      const s = -Math.sin(omega * last);
      phasors[signal].re[order] = scale * (yRe * c - yIm * s);
      phasors[signal].im[order] = scale * (yRe * s + yIm * c);
    }
  }
  return phasors;
}

// Five recursions side by side keep the processor busy while each waits on its own previous
// step; more would no longer fit in registers.
const LANES = 5;

/**
 * Five Goertzel recursions s[i] = w[i]·x[first + i] + k·s[i−1] − s[i−2], one per lane, each
 * with its own input and coefficient k = 2·cos ω. Two samples per step let the two states of a
 * lane swap roles instead of being copied. Leaves s[L−1], s[L−2] of lane l in
 * states[2l], states[2l + 1].
 */
function goertzelLanes(
  inputs: readonly Float64Array[],
  span: HannSpan,
  k: Float64Array,
  states: Float64Array,
): void {
  const { first, weights } = span;
  const [x0, x1, x2, x3, x4] = inputs;
  const k0 = k[0];
  const k1 = k[1];
  const k2 = k[2];
  const k3 = k[3];
  const k4 = k[4];
  // a1, a2 hold s[i−1], s[i−2] of lane 0; b… e… the same for lanes 1…4.
  let a1 = 0, a2 = 0, b1 = 0, b2 = 0, c1 = 0, c2 = 0, d1 = 0, d2 = 0, e1 = 0, e2 = 0;
  const length = weights.length;
  let i = 0;
  for (; i + 1 < length; i += 2) {
    const u = weights[i];
    const v = weights[i + 1];
    const n = first + i;
    a2 = x0[n] * u + k0 * a1 - a2;
    a1 = x0[n + 1] * v + k0 * a2 - a1;
    b2 = x1[n] * u + k1 * b1 - b2;
    b1 = x1[n + 1] * v + k1 * b2 - b1;
    c2 = x2[n] * u + k2 * c1 - c2;
    c1 = x2[n + 1] * v + k2 * c2 - c1;
    d2 = x3[n] * u + k3 * d1 - d2;
    d1 = x3[n + 1] * v + k3 * d2 - d1;
    e2 = x4[n] * u + k4 * e1 - e2;
    e1 = x4[n + 1] * v + k4 * e2 - e1;
  }
  if (i < length) {
    const u = weights[i];
    const n = first + i;
    [a1, a2] = [x0[n] * u + k0 * a1 - a2, a1];
    [b1, b2] = [x1[n] * u + k1 * b1 - b2, b1];
    [c1, c2] = [x2[n] * u + k2 * c1 - c2, c1];
    [d1, d2] = [x3[n] * u + k3 * d1 - d2, d1];
    [e1, e2] = [x4[n] * u + k4 * e1 - e2, e1];
  }
  states.set([a1, a2, b1, b2, c1, c2, d1, d2, e1, e2]);
}

/** Levels of one signal over the span: Hann-weighted DC and true RMS, and the peak about DC. */
export interface SpanLevels {
  dcV: number;
  rmsV: number;
  peakV: number;
}

/**
 * DC level and RMS about it as Hann-weighted means over the whole-cycle span: for a periodic
 * signal the Hann-weighted mean of x and of x² equal the plain whole-cycle means (the window's
 * spectrum is zero at every multiple of the cycle count from 2 up, Harris 1978), yet they do not
 * depend on where the span meets the sample grid. The peak is the largest |x − DC| of the
 * samples inside the span.
 */
export function spanLevels(x: Float64Array, span: HannSpan): SpanLevels {
  const { first, weights, weightSum } = span;
  let weightedSum = 0;
  for (let i = 0; i < weights.length; i++) weightedSum += weights[i] * x[first + i];
  const dcV = weightedSum / weightSum;
  let weightedSquares = 0;
  let peakV = 0;
  for (let i = 0; i < weights.length; i++) {
    const ac = x[first + i] - dcV;
    weightedSquares += weights[i] * ac * ac;
    peakV = Math.max(peakV, Math.abs(ac));
  }
  return { dcV, rmsV: Math.sqrt(weightedSquares / weightSum), peakV };
}
