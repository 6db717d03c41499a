import { describe, expect, it } from 'vitest';
import { analyzeBackEmf } from '../../../../server/analysis/waveform/index.js';
import { balancedLines, samplesFor, wave, type Harmonic } from './synthetic.js';

const SAMPLE_RATE_HZ = 20_000;
const POLE_PAIRS = 4;
// 133.3 Hz at 20 kHz is 150.04 samples per cycle, so no span of whole cycles ends on a sample.
const ELECTRICAL_HZ = 133.3;
const SPEED_RPM = (60 * ELECTRICAL_HZ) / POLE_PAIRS;
const FIVE_AND_SEVEN: Harmonic[] = [
  { order: 1, amplitudeV: 100 },
  { order: 5, amplitudeV: 3, phaseRad: 0.4 },
  { order: 7, amplitudeV: 1.5, phaseRad: -1.1 },
];

function analyze(lines: ReturnType<typeof balancedLines>, speedRpm = SPEED_RPM, sampleRateHz = SAMPLE_RATE_HZ) {
  return analyzeBackEmf({ sampleRateHz, speedRpm, polePairs: POLE_PAIRS, lineToLineV: lines });
}

/** Largest value of the continuous waveform, found by brute force on a fine grid. */
function continuousPeakV(harmonics: Harmonic[]): number {
  let peak = 0;
  for (let i = 0; i < 1_000_000; i++) {
    const angle = (2 * Math.PI * i) / 1_000_000;
    const v = harmonics.reduce((sum, h) => sum + h.amplitudeV * Math.sin(h.order * angle + (h.phaseRad ?? 0)), 0);
    peak = Math.max(peak, Math.abs(v));
  }
  return peak;
}

describe('analyzeBackEmf on a record of 10.37 cycles', () => {
  const samples = samplesFor(10.37, SAMPLE_RATE_HZ, ELECTRICAL_HZ);
  const result = analyze(balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples, harmonics: FIVE_AND_SEVEN }));

  it('when the record is not a whole number of cycles, then the frequency is measured to 1e-4 and 10 cycles are analysed', () => {
    // f = p·n/60 (common practice) is how the synthetic speed was set; the analysis measures f itself.
    expect(Math.abs(result.electricalHz / ELECTRICAL_HZ - 1)).toBeLessThan(1e-4);
    expect(Math.abs(result.electricalHz / ELECTRICAL_HZ - 1)).toBeLessThan(1e-9); // noise-free: far better
    expect(result.cycles).toBe(10);
    expect(result.polePairsFromFrequency).toBe(POLE_PAIRS);
  });

  it('when the 5th is 3 % and the 7th 1.5 %, then each is found within 0.1 % of its value and the 3rd is absent', () => {
    // Reference: the amplitudes the signal was built with (synthetic.ts), as percent of V₁ = 100 V
    for (const line of ['uv', 'vw', 'wu'] as const) {
      expect(result.harmonicsPercent[line][5]).toBeCloseTo(3, 3); // 0.1 % of 3 % is 0.003
      expect(Math.abs(result.harmonicsPercent[line][5] / 3 - 1)).toBeLessThan(1e-3);
      expect(Math.abs(result.harmonicsPercent[line][7] / 1.5 - 1)).toBeLessThan(1e-3);
      expect(result.harmonicsPercent[line][3]).toBeLessThan(1e-4);
      expect(Object.keys(result.harmonicsPercent[line]).map(Number)).toEqual(
        Array.from({ length: 24 }, (_, i) => i + 2),
      );
    }
  });

  it('when THD is computed, then it equals the IEEE Std 519-2014 definition applied to the known amplitudes', () => {
    // IEEE Std 519-2014: THD = √(Σ V_h²)/V₁ = √(3² + 1.5²)/100 = 3.3541 %
    const expected = (100 * Math.hypot(3, 1.5)) / 100;
    for (const line of ['uv', 'vw', 'wu'] as const) {
      expect(Math.abs(result.thdPercent[line] / expected - 1)).toBeLessThan(1e-3);
    }
  });

  it('when the fundamental is 100 V peak, then Ke is its RMS per 1000 rpm within 0.1 %', () => {
    // Ke = V_LL,rms / (n/1000) (DOMAIN, standard PMSM relation); V_rms = V̂/√2 for a sine
    const expected = 100 / Math.SQRT2 / (SPEED_RPM / 1000);
    expect(Math.abs(result.keVPerKrpm / expected - 1)).toBeLessThan(1e-3);
  });

  it('when RMS and peak are taken over whole cycles, then they match the waveform definition', () => {
    // True RMS of a sum of harmonics: √(Σ A_h²/2) (Parseval; IEC 60050-103 r.m.s. value)
    const expectedRms = Math.sqrt(FIVE_AND_SEVEN.reduce((sum, h) => sum + h.amplitudeV ** 2 / 2, 0));
    const expectedPeak = continuousPeakV(FIVE_AND_SEVEN);
    for (const line of ['uv', 'vw', 'wu'] as const) {
      expect(Math.abs(result.rmsV[line] / expectedRms - 1)).toBeLessThan(1e-6);
      // 150 samples a cycle: a sample lands within 1.2° of the crest, so at most 0.1 % low
      expect(result.peakV[line]).toBeLessThanOrEqual(expectedPeak * (1 + 1e-12));
      expect(result.peakV[line]).toBeGreaterThan(expectedPeak * 0.999);
    }
  });

  it('when the lines are balanced in UVW order, then each lags the previous by 120° and unbalance is 0', () => {
    // A balanced three-phase set is 120° apart in U-V-W order (common practice); NEMA MG 1 of equal values is 0
    expect(result.sequence).toBe('UVW');
    for (const spacing of Object.values(result.phaseSpacingDeg)) expect(spacing).toBeCloseTo(120, 6);
    expect(result.unbalancePercent).toBeLessThan(1e-6);
  });
});

describe('analyzeBackEmf with DC offset and noise', () => {
  const samples = samplesFor(10.37, 50_000, 100.37);
  const noiseV = 0.1;
  const lines = balancedLines({
    sampleRateHz: 50_000,
    electricalHz: 100.37,
    samples,
    harmonics: FIVE_AND_SEVEN,
    dcV: 4.5,
    noiseV,
    seed: 7,
  });
  const result = analyzeBackEmf({ sampleRateHz: 50_000, speedRpm: (60 * 100.37) / 4, polePairs: 4, lineToLineV: lines });

  it('when 4.5 V DC and 0.1 V Gaussian noise are added, then the harmonics stay within their statistical error', () => {
    // Standard error of a Hann-weighted DFT amplitude: σ·√(2·ENBW/L) with ENBW = 1.5 bins
    // (Harris 1978); allow five standard errors.
    const spanSamples = 10 * (50_000 / 100.37);
    const tolerancePercent = (5 * 100 * noiseV * Math.sqrt((2 * 1.5) / spanSamples)) / 100;
    expect(Math.abs(result.electricalHz / 100.37 - 1)).toBeLessThan(1e-4);
    for (const line of ['uv', 'vw', 'wu'] as const) {
      expect(Math.abs(result.harmonicsPercent[line][5] - 3)).toBeLessThan(tolerancePercent);
      expect(Math.abs(result.harmonicsPercent[line][7] - 1.5)).toBeLessThan(tolerancePercent);
      expect(result.thdPercent[line]).toBeCloseTo((100 * Math.hypot(3, 1.5)) / 100, 1);
      // RMS about DC of signal plus independent noise: √(Σ A_h²/2 + σ²)
      const expectedRms = Math.sqrt((100 ** 2 + 3 ** 2 + 1.5 ** 2) / 2 + noiseV ** 2);
      expect(Math.abs(result.rmsV[line] / expectedRms - 1)).toBeLessThan(1e-3);
    }
  });

  it('when plain arrays are passed instead of Float64Array, then the result is the same', () => {
    const plain = { uv: Array.from(lines.uv), vw: Array.from(lines.vw), wu: Array.from(lines.wu) };
    // Same samples, other container: the result must not depend on it (brief: number[] or Float64Array)
    const again = analyzeBackEmf({ sampleRateHz: 50_000, speedRpm: (60 * 100.37) / 4, polePairs: 4, lineToLineV: plain });
    expect(again).toEqual(result);
  });
});

describe('analyzeBackEmf on engineering examples', () => {
  it('when V₁ = 100, V₃ = 5, V₅ = 3, V₇ = 1, then THD is 5.9161 %', () => {
    // DOMAIN worked example of the IEEE Std 519-2014 definition: √(25 + 9 + 1)/100 = 5.9161 %
    const harmonics = [1, 3, 5, 7].map((order, i) => ({ order, amplitudeV: [100, 5, 3, 1][i], phaseRad: 0.3 * i }));
    const lines = balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(12.6, SAMPLE_RATE_HZ, ELECTRICAL_HZ), harmonics });
    const result = analyze(lines);
    expect(result.thdPercent.uv).toBeCloseTo(5.9161, 4);
    expect(result.harmonicsPercent.uv[3]).toBeCloseTo(5, 4);
  });

  it('when a 2nd, a 25th and a 26th harmonic are present, then THD sums exactly the orders 2…25', () => {
    // IEEE Std 519-2014 definition over h = 2…25: √(2² + 0.5²)/100 = 2.0616 %; the 26th is outside
    const harmonics = [
      { order: 1, amplitudeV: 100 },
      { order: 2, amplitudeV: 2, phaseRad: 1 },
      { order: 25, amplitudeV: 0.5, phaseRad: -0.5 },
      { order: 26, amplitudeV: 0.7 },
    ];
    const lines = balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(10.37, SAMPLE_RATE_HZ, ELECTRICAL_HZ), harmonics });
    const result = analyze(lines);
    expect(result.thdPercent.wu).toBeCloseTo(Math.hypot(2, 0.5), 4);
    expect(result.harmonicsPercent.wu[2]).toBeCloseTo(2, 4);
    expect(result.harmonicsPercent.wu[25]).toBeCloseTo(0.5, 4);
  });

  it('when the fundamentals are 462, 463 and 455 V RMS, then the NEMA MG 1 unbalance is 1.087 %', () => {
    // NEMA MG 1: mean 460 V, largest deviation 5 V → 100 × 5/460 = 1.087 %
    const spec = { sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(9.8, SAMPLE_RATE_HZ, ELECTRICAL_HZ) };
    const line = (rmsV: number, shiftRad: number) => wave({ ...spec, shiftRad, harmonics: [{ order: 1, amplitudeV: rmsV * Math.SQRT2 }] });
    const result = analyze({ uv: line(462, 0), vw: line(463, (-2 * Math.PI) / 3), wu: line(455, (-4 * Math.PI) / 3) });
    expect(result.unbalancePercent).toBeCloseTo(1.087, 3);
    expect(Math.abs(result.unbalancePercent - 1.087)).toBeLessThanOrEqual(0.001);
  });

  it('when the line voltage is 50 V RMS at 1000 rpm with 4 pole pairs, then Ke is 50 V/krpm at 66.67 Hz', () => {
    // Ke = V_LL,rms/(n/1000) (DOMAIN); f = p·n/60 = 4 · 1000/60 (common practice)
    const electricalHz = (4 * 1000) / 60;
    const lines = balancedLines({ sampleRateHz: 10_000, electricalHz, samples: samplesFor(7.25, 10_000, electricalHz), harmonics: [{ order: 1, amplitudeV: 50 * Math.SQRT2 }] });
    const result = analyzeBackEmf({ sampleRateHz: 10_000, speedRpm: 1000, polePairs: 4, lineToLineV: lines });
    expect(result.keVPerKrpm).toBeCloseTo(50, 6);
    expect(result.electricalHz).toBeCloseTo(66.6667, 4);
  });

  it('when 4 pole pairs turn at 1500 rpm, then the measured frequency is 100 Hz and 4 pole pairs are inferred', () => {
    // f = p·n/60 = 4 · 1500/60 = 100 Hz (common practice)
    const lines = balancedLines({ sampleRateHz: 25_000, electricalHz: 100, samples: 3_333, harmonics: FIVE_AND_SEVEN });
    const result = analyzeBackEmf({ sampleRateHz: 25_000, speedRpm: 1500, polePairs: 4, lineToLineV: lines });
    expect(result.electricalHz).toBeCloseTo(100, 6);
    expect(result.polePairsFromFrequency).toBe(4);
    // declared 3 pole pairs but spun to 100 Hz at 1500 rpm: the frequency still says 4
    expect(analyzeBackEmf({ sampleRateHz: 25_000, speedRpm: 1500, polePairs: 3, lineToLineV: lines }).polePairsFromFrequency).toBe(4);
  });

  it('when vw and wu are exchanged, then the sequence is UWV and each line lags the previous by 240°', () => {
    // Exchanging two lines reverses the phase sequence (common practice): −120° ≡ 240° lag
    const lines = balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(8.5, SAMPLE_RATE_HZ, ELECTRICAL_HZ), harmonics: FIVE_AND_SEVEN });
    const result = analyze({ uv: lines.uv, vw: lines.wu, wu: lines.vw });
    expect(result.sequence).toBe('UWV');
    for (const spacing of Object.values(result.phaseSpacingDeg)) expect(spacing).toBeCloseTo(240, 6);
  });

  it('when one phase EMF is 5 % low, then the line-voltage unbalance and spacing follow phasor arithmetic', () => {
    // Line-to-neutral U at 0.95 pu, V and W at 1 pu; line voltages are differences of phase
    // voltages, so by the law of cosines |U − V| = √(0.95² + 1 + 0.95) and |V − W| = √3.
    const spec = { sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(11.2, SAMPLE_RATE_HZ, ELECTRICAL_HZ) };
    const phase = (amplitudeV: number, shiftRad: number) => wave({ ...spec, shiftRad, harmonics: [{ order: 1, amplitudeV }] });
    const [u, v, w] = [phase(95, 0), phase(100, (-2 * Math.PI) / 3), phase(100, (-4 * Math.PI) / 3)];
    const minus = (a: Float64Array, b: Float64Array) => a.map((x, i) => x - b[i]);
    const result = analyze({ uv: minus(u, v), vw: minus(v, w), wu: minus(w, u) });
    const uvV = Math.sqrt(0.95 ** 2 + 1 + 0.95);
    const vwV = Math.sqrt(3);
    const mean = (2 * uvV + vwV) / 3;
    const expected = (100 * Math.max(Math.abs(uvV - mean), Math.abs(vwV - mean))) / mean; // NEMA MG 1
    expect(result.unbalancePercent).toBeCloseTo(expected, 6);
    expect(result.unbalancePercent).toBeGreaterThan(1.5);
    // angle of U − V against V − W from the phasors themselves
    const angle = (re: number, im: number) => Math.atan2(im, re);
    const uvAngle = angle(0.95 - Math.cos((-2 * Math.PI) / 3), -Math.sin((-2 * Math.PI) / 3));
    const vwAngle = angle(Math.cos((-2 * Math.PI) / 3) - Math.cos((-4 * Math.PI) / 3), Math.sin((-2 * Math.PI) / 3) - Math.sin((-4 * Math.PI) / 3));
    expect(result.phaseSpacingDeg.uvToVw).toBeCloseTo(((uvAngle - vwAngle) * 180) / Math.PI, 6);
    expect(result.sequence).toBe('UVW');
  });

  it('when the record holds just over two cycles, then the frequency is still within 1e-4', () => {
    // Reference: the frequency and 5th-harmonic amplitude the signal was built with
    const lines = balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(2.3, SAMPLE_RATE_HZ, ELECTRICAL_HZ), harmonics: FIVE_AND_SEVEN });
    const result = analyze(lines);
    expect(result.cycles).toBe(2);
    expect(Math.abs(result.electricalHz / ELECTRICAL_HZ - 1)).toBeLessThan(1e-4);
    expect(Math.abs(result.harmonicsPercent.uv[5] / 3 - 1)).toBeLessThan(1e-3);
  });
});

describe('analyzeBackEmf levels', () => {
  const spec = { sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(6.77, SAMPLE_RATE_HZ, ELECTRICAL_HZ) };

  it('when the waveform swings further below DC than above, then peakV is the larger excursion', () => {
    // 100·sin θ + 20·cos 2θ reaches +80 V at 90° but −120 V at 270°; brute force on the continuous curve
    const harmonics = [{ order: 1, amplitudeV: 100 }, { order: 2, amplitudeV: 20, phaseRad: Math.PI / 2 }];
    const result = analyze(balancedLines({ ...spec, harmonics, dcV: 15 }));
    const expected = continuousPeakV(harmonics);
    expect(expected).toBeCloseTo(120, 6);
    expect(result.peakV.uv).toBeLessThanOrEqual(expected * (1 + 1e-12));
    expect(result.peakV.uv).toBeGreaterThan(expected * 0.999);
  });

  it('when a DC offset dwarfs the waveform, then the RMS about DC keeps its precision', () => {
    // True RMS about DC of a 100 V-peak sine is 100/√2 whatever the offset (IEC 60050-103)
    const result = analyze(balancedLines({ ...spec, harmonics: [{ order: 1, amplitudeV: 100 }], dcV: 1e6 }));
    expect(Math.abs(result.rmsV.vw / (100 / Math.SQRT2) - 1)).toBeLessThan(1e-9);
  });
});

describe('analyzeBackEmf input checks', () => {
  const lines = balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(5.5, SAMPLE_RATE_HZ, ELECTRICAL_HZ), harmonics: FIVE_AND_SEVEN });
  const base = { sampleRateHz: SAMPLE_RATE_HZ, speedRpm: SPEED_RPM, polePairs: POLE_PAIRS, lineToLineV: lines };

  it('when the record holds fewer than two cycles, then it throws naming lineToLineV', () => {
    const short = balancedLines({ sampleRateHz: SAMPLE_RATE_HZ, electricalHz: ELECTRICAL_HZ, samples: samplesFor(1.6, SAMPLE_RATE_HZ, ELECTRICAL_HZ), harmonics: FIVE_AND_SEVEN });
    expect(() => analyzeBackEmf({ ...base, lineToLineV: short })).toThrow(/lineToLineV.*two electrical cycles/);
  });

  it('when the lines differ in length, then it throws naming the shorter line', () => {
    expect(() => analyzeBackEmf({ ...base, lineToLineV: { ...lines, vw: lines.vw.subarray(1) } })).toThrow(/lineToLineV\.vw must hold as many samples/);
  });

  it('when a sample is NaN, then it throws naming the line and index', () => {
    const wu = Array.from(lines.wu);
    wu[10] = Number.NaN;
    expect(() => analyzeBackEmf({ ...base, lineToLineV: { ...lines, wu } })).toThrow(/lineToLineV\.wu\[10\] must be a finite number/);
  });

  it('when a rate, speed or pole-pair count is not positive, then it throws naming it', () => {
    expect(() => analyzeBackEmf({ ...base, sampleRateHz: 0 })).toThrow(/sampleRateHz/);
    expect(() => analyzeBackEmf({ ...base, speedRpm: -1500 })).toThrow(/speedRpm/);
    expect(() => analyzeBackEmf({ ...base, polePairs: 0 })).toThrow(/polePairs/);
    expect(() => analyzeBackEmf({ ...base, polePairs: 2.5 })).toThrow(/polePairs.*whole/);
  });

  it('when the sample rate cannot carry the 25th harmonic, then it throws naming sampleRateHz', () => {
    // Nyquist–Shannon: 25 × 133.3 Hz = 3.3 kHz needs more than 6.7 kHz sampling
    const slow = balancedLines({ sampleRateHz: 5_000, electricalHz: ELECTRICAL_HZ, samples: 500, harmonics: [{ order: 1, amplitudeV: 100 }] });
    expect(() => analyzeBackEmf({ ...base, sampleRateHz: 5_000, lineToLineV: slow })).toThrow(/sampleRateHz must exceed 50/);
  });

  it('when a line is not an array, then it throws naming it', () => {
    expect(() => analyzeBackEmf({ ...base, lineToLineV: { ...lines, uv: 'x' as unknown as number[] } })).toThrow(/lineToLineV\.uv must be an array/);
  });
});
