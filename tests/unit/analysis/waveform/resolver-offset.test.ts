import { describe, expect, it } from 'vitest';
import { resolverOffset, wrapDegrees180 } from '../../../../server/analysis/waveform/index.js';
import { seededGaussian } from './synthetic.js';

interface SpinSpec {
  sampleRateHz?: number;
  electricalHz?: number;
  cycles?: number;
  polePairs?: number;
  resolverPolePairs?: number;
  /** Resolver angle minus rotor electrical angle, in motor electrical degrees. */
  offsetDeg: number;
  /** Once-per-revolution eccentricity of the resolver reading, in resolver electrical degrees. */
  wobbleDeg?: number;
  emfNoiseV?: number;
  resolverNoiseDeg?: number;
  /** Harmonics of the line-to-neutral EMF, percent of the fundamental, keyed by order. */
  harmonicsPercent?: Record<number, number>;
  reversed?: boolean;
}

const DEG = Math.PI / 180;

/**
 * A spin with the rotor's electrical angle θ known at every sample: line-to-neutral EMFs
 * e_u = E·sin θ, e_v = E·sin(θ − 120°), and uv = e_u − e_v (so uv ∝ sin(θ + 30°) follows from the
 * trigonometric identity sin a − sin b = 2·cos((a+b)/2)·sin((a−b)/2), not from the code under
 * test). The resolver turns with the rotor: resolverPolePairs electrical turns per mechanical turn.
 */
function spin(spec: SpinSpec) {
  const sampleRateHz = spec.sampleRateHz ?? 20_000;
  const electricalHz = spec.electricalHz ?? 133.3;
  const polePairs = spec.polePairs ?? 4;
  const resolverPolePairs = spec.resolverPolePairs ?? 1;
  const ratio = polePairs / resolverPolePairs;
  const samples = Math.round(((spec.cycles ?? 10.37) * sampleRateHz) / electricalHz);
  const emfNoise = seededGaussian(11);
  const angleNoise = seededGaussian(12);
  const thetaAtStartDeg = 71.3;
  const emf = (angleDeg: number) =>
    Object.entries(spec.harmonicsPercent ?? {}).reduce(
      (sum, [order, percent]) => sum + (percent / 100) * Math.sin(Number(order) * angleDeg * DEG),
      Math.sin(angleDeg * DEG),
    );
  const backEmfUvV = new Float64Array(samples);
  const resolverAngleDeg = new Float64Array(samples);
  for (let n = 0; n < samples; n++) {
    const thetaDeg = thetaAtStartDeg + (360 * electricalHz * n) / sampleRateHz;
    backEmfUvV[n] = 200 * (emf(thetaDeg) - emf(thetaDeg - 120)) + (spec.emfNoiseV ?? 0) * emfNoise();
    const mechanicalDeg = thetaDeg / polePairs;
    const resolverDeg =
      (spec.reversed ? -1 : 1) * (thetaDeg + spec.offsetDeg) / ratio +
      (spec.wobbleDeg ?? 0) * Math.sin(mechanicalDeg * DEG) +
      (spec.resolverNoiseDeg ?? 0) * angleNoise();
    resolverAngleDeg[n] = ((resolverDeg % 360) + 360) % 360; // an R/D converter reads 0…360°
  }
  return { sampleRateHz, polePairs, resolverPolePairs, backEmfUvV, resolverAngleDeg };
}

describe('resolverOffset', () => {
  it('when the resolver reads 37.5° ahead of θ with a 1-pole-pair resolver on 4 pole pairs, then the offset is +37.5°', () => {
    // Reference: the offset built into spin(); motor electrical = resolver × 4/1 (DOMAIN resolver section)
    const result = resolverOffset(spin({ offsetDeg: 37.5 }));
    expect(result.offsetDeg).toBeCloseTo(37.5, 6);
    expect(result.spreadDeg).toBeLessThan(1e-6);
  });

  it('when the resolver has as many pole pairs as the motor, then −170° is found', () => {
    // ratio 4/4 = 1: the resolver angle is the motor electrical angle (DOMAIN resolver section)
    const result = resolverOffset(spin({ offsetDeg: -170, resolverPolePairs: 4 }));
    expect(result.offsetDeg).toBeCloseTo(-170, 6);
  });

  it('when the offset is zero, then the resolver reads 0 where e_u crosses zero going positive', () => {
    // The convention itself: θ = 0 at the positive-going zero crossing of the U line-to-neutral EMF.
    const result = resolverOffset(spin({ offsetDeg: 0, resolverPolePairs: 2 }));
    expect(Math.abs(result.offsetDeg)).toBeLessThan(1e-6);
  });

  it('when the offset is near ±180°, then it wraps into (−180°, 180°]', () => {
    for (const offsetDeg of [179.95, -179.95, 180]) {
      const result = resolverOffset(spin({ offsetDeg }));
      expect(result.offsetDeg).toBeGreaterThan(-180);
      expect(result.offsetDeg).toBeLessThanOrEqual(180);
      expect(Math.abs(wrapDegrees180(result.offsetDeg - offsetDeg))).toBeLessThan(1e-6);
    }
    expect(resolverOffset(spin({ offsetDeg: 180 })).offsetDeg).toBeCloseTo(180, 6);
  });

  it('when the resolver wobbles ±0.5° once a turn, then the spread is the peak-to-peak 4 motor electrical degrees', () => {
    // 12 electrical cycles = 3 whole turns of a 4-pole-pair rotor, so the wobble averages out.
    // An eccentric resolver errs by a once-per-turn sinusoid (common practice); ×4 to motor degrees.
    const result = resolverOffset(spin({ offsetDeg: 37.5, wobbleDeg: 0.5, cycles: 12.0005 }));
    expect(result.spreadDeg).toBeCloseTo(2 * 0.5 * 4, 3);
    expect(result.offsetDeg).toBeCloseTo(37.5, 2);
  });

  it('when the EMF carries 3rd, 5th and 7th harmonics, then the offset is unchanged', () => {
    // line-to-neutral 5th and 7th do not cancel in uv, unlike the 3rd (DOMAIN, common practice);
    // the fundamental's phase is what defines θ, so they must not move it
    const result = resolverOffset(spin({ offsetDeg: 12.25, harmonicsPercent: { 3: 4, 5: 3, 7: 1.5 } }));
    expect(result.offsetDeg).toBeCloseTo(12.25, 6);
  });

  it('when both readings are noisy, then the offset stays within 0.05° and the spread reflects the resolver noise', () => {
    const sigmaDeg = 0.02;
    const spec = { offsetDeg: -63.2, emfNoiseV: 3, resolverNoiseDeg: sigmaDeg, cycles: 40.3 };
    const { resolverAngleDeg } = spin(spec);
    const result = resolverOffset(spin(spec));
    expect(Math.abs(result.offsetDeg + 63.2)).toBeLessThan(0.05);
    // Peak-to-peak of N Gaussian samples ≈ 2σ·√(2 ln N) (extreme-value theory, Cramér 1946);
    // bound it loosely, in motor electrical degrees (×4).
    const n = resolverAngleDeg.length;
    const expectedSpread = 2 * sigmaDeg * 4 * Math.sqrt(2 * Math.log(n));
    expect(result.spreadDeg).toBeGreaterThan(0.7 * expectedSpread);
    expect(result.spreadDeg).toBeLessThan(1.3 * expectedSpread);
  });
});

describe('resolverOffset input checks', () => {
  const base = spin({ offsetDeg: 10 });

  it('when polePairs is not a multiple of resolverPolePairs, then it throws naming resolverPolePairs', () => {
    expect(() => resolverOffset({ ...base, resolverPolePairs: 3 })).toThrow(/resolverPolePairs must divide polePairs/);
  });

  it('when the resolver turns the other way or at another speed, then it throws naming resolverAngleDeg', () => {
    expect(() => resolverOffset(spin({ offsetDeg: 10, reversed: true }))).toThrow(/resolverAngleDeg must advance.*direction/);
    expect(() => resolverOffset({ ...base, resolverPolePairs: 2 })).toThrow(/resolverAngleDeg must advance/);
  });

  it('when the records differ in length or hold NaN, then it throws naming the argument', () => {
    expect(() => resolverOffset({ ...base, resolverAngleDeg: base.resolverAngleDeg.subarray(2) })).toThrow(/resolverAngleDeg must hold as many samples as backEmfUvV/);
    const angles = Array.from(base.resolverAngleDeg);
    angles[3] = Number.NaN;
    expect(() => resolverOffset({ ...base, resolverAngleDeg: angles })).toThrow(/resolverAngleDeg\[3\] must be a finite number/);
  });

  it('when the record holds fewer than two cycles, then it throws naming backEmfUvV', () => {
    const short = spin({ offsetDeg: 10, cycles: 1.5 });
    expect(() => resolverOffset(short)).toThrow(/backEmfUvV.*two electrical cycles/);
  });

  it('when a count or rate is not positive, then it throws naming it', () => {
    expect(() => resolverOffset({ ...base, sampleRateHz: -1 })).toThrow(/sampleRateHz/);
    expect(() => resolverOffset({ ...base, polePairs: 0 })).toThrow(/polePairs/);
    expect(() => resolverOffset({ ...base, resolverPolePairs: 0.5 })).toThrow(/resolverPolePairs/);
  });
});
