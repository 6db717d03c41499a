import type { HannSpan } from './hann-span.js';

/** Complex amplitudes by harmonic order: index h holds order h (index 0 is not used). */
export interface HarmonicPhasors {
  re: Float64Array;
  im: Float64Array;
}

// Five recursions side by side keep the processor busy while each waits on its own previous
// step; more no longer fit in registers and gain nothing.
const LANES = 5;

/**
 * Complex amplitudes c_h = 2·Σ w·x·e^(−j·h·ω·n) / Σ w of orders 1…highestOrder over a Hann span
 * (hann-span.ts), with n counted from the first sample of the record: a component
 * A·cos(h·ω·n + φ) gives c_h = A·e^(jφ). `weighted` holds w·x for the span's samples. Each sum is
 * a Goertzel recursion (Goertzel 1958, Amer. Math. Monthly 65(1)): one multiply per sample and
 * order instead of a complex rotation.
 */
export function harmonicPhasors(
  weighted: Float64Array,
  span: HannSpan,
  omegaRadPerSample: number,
  highestOrder: number,
): HarmonicPhasors {
  const re = new Float64Array(highestOrder + 1);
  const im = new Float64Array(highestOrder + 1);
  const last = span.first + weighted.length - 1;
  const scale = 2 / span.weightSum;
  const coefficients = new Float64Array(LANES);
  const states = new Float64Array(2 * LANES);
  for (let lowest = 1; lowest <= highestOrder; lowest += LANES) {
    for (let lane = 0; lane < LANES; lane++) {
      coefficients[lane] = 2 * Math.cos((lowest + lane) * omegaRadPerSample);
    }
    goertzelLanes(weighted, coefficients, states);
    for (let order = lowest; order <= Math.min(lowest + LANES - 1, highestOrder); order++) {
      const lane = order - lowest;
      const omega = order * omegaRadPerSample;
      // s₁ − e^(−jω)·s₂ = Σ y[i]·e^(jω(L−1−i)); rotate it back to the record's first sample.
      const yRe = states[2 * lane] - Math.cos(omega) * states[2 * lane + 1];
      const yIm = Math.sin(omega) * states[2 * lane + 1];
      const c = Math.cos(omega * last);
      const s = -Math.sin(omega * last);
      re[order] = scale * (yRe * c - yIm * s);
      im[order] = scale * (yRe * s + yIm * c);
    }
  }
  return { re, im };
}

/**
 * Five Goertzel recursions s[i] = y[i] + k·s[i−1] − s[i−2] over the same input, lane l with
 * coefficient k[l] = 2·cos ω_l. Two samples per step let a lane's two states swap roles instead
 * of being copied. Leaves s[L−1], s[L−2] of lane l in states[2l], states[2l + 1].
 */
function goertzelLanes(y: Float64Array, k: Float64Array, states: Float64Array): void {
  const k0 = k[0];
  const k1 = k[1];
  const k2 = k[2];
  const k3 = k[3];
  const k4 = k[4];
  // a1, a2 hold s[i−1], s[i−2] of lane 0; b…, c…, d…, e… the same for lanes 1…4.
  let a1 = 0, a2 = 0, b1 = 0, b2 = 0, c1 = 0, c2 = 0, d1 = 0, d2 = 0, e1 = 0, e2 = 0;
  const length = y.length;
  let i = 0;
  for (; i + 1 < length; i += 2) {
    const p = y[i];
    const q = y[i + 1];
    a2 = p + k0 * a1 - a2;
    a1 = q + k0 * a2 - a1;
    b2 = p + k1 * b1 - b2;
    b1 = q + k1 * b2 - b1;
    c2 = p + k2 * c1 - c2;
    c1 = q + k2 * c2 - c1;
    d2 = p + k3 * d1 - d2;
    d1 = q + k3 * d2 - d1;
    e2 = p + k4 * e1 - e2;
    e1 = q + k4 * e2 - e1;
  }
  if (i < length) {
    const p = y[i];
    [a1, a2] = [p + k0 * a1 - a2, a1];
    [b1, b2] = [p + k1 * b1 - b2, b1];
    [c1, c2] = [p + k2 * c1 - c2, c1];
    [d1, d2] = [p + k3 * d1 - d2, d1];
    [e1, e2] = [p + k4 * e1 - e2, e1];
  }
  states.set([a1, a2, b1, b2, c1, c2, d1, d2, e1, e2]);
}
