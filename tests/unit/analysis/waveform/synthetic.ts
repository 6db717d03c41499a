/**
 * Synthetic test signals whose content is known analytically, and a seeded noise source, so
 * every expected value in the waveform tests follows from the signal's definition.
 */

/** Mulberry32: a small 32-bit seeded PRNG (public-domain construction, common practice). */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform (Box & Muller 1958). */
export function seededGaussian(seed: number): () => number {
  const uniform = seededUniform(seed);
  return () => {
    const u = 1 - uniform(); // (0, 1], so the logarithm stays finite
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}

export interface Harmonic {
  order: number;
  amplitudeV: number;
  phaseRad?: number;
}

export interface WaveSpec {
  sampleRateHz: number;
  electricalHz: number;
  samples: number;
  harmonics: Harmonic[];
  /** Shift of the fundamental; harmonic h is shifted h times as much. */
  shiftRad?: number;
  dcV?: number;
  noiseV?: number;
  seed?: number;
}

/** v(t) = dc + Σ A_h·sin(h·(2π·f·t + shift) + φ_h) + Gaussian noise of σ = noiseV. */
export function wave(spec: WaveSpec): Float64Array {
  const noise = seededGaussian(spec.seed ?? 1);
  const out = new Float64Array(spec.samples);
  for (let n = 0; n < spec.samples; n++) {
    const angle = 2 * Math.PI * spec.electricalHz * (n / spec.sampleRateHz) + (spec.shiftRad ?? 0);
    let v = spec.dcV ?? 0;
    for (const h of spec.harmonics) v += h.amplitudeV * Math.sin(h.order * angle + (h.phaseRad ?? 0));
    out[n] = v + (spec.noiseV ? spec.noiseV * noise() : 0);
  }
  return out;
}

/** Balanced line voltages in UVW sequence: vw lags uv by 120°, wu by 240°. */
export function balancedLines(spec: Omit<WaveSpec, 'shiftRad'>): { uv: Float64Array; vw: Float64Array; wu: Float64Array } {
  const third = (2 * Math.PI) / 3;
  return {
    uv: wave({ ...spec, shiftRad: 0, seed: (spec.seed ?? 1) * 3 }),
    vw: wave({ ...spec, shiftRad: -third, seed: (spec.seed ?? 1) * 3 + 1 }),
    wu: wave({ ...spec, shiftRad: -2 * third, seed: (spec.seed ?? 1) * 3 + 2 }),
  };
}

/** Samples in `cycles` electrical cycles, rounded to a whole sample. */
export function samplesFor(cycles: number, sampleRateHz: number, electricalHz: number): number {
  return Math.round((cycles * sampleRateHz) / electricalHz);
}
