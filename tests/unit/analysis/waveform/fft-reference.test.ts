import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { analyzeBackEmf } from '../../../../server/analysis/waveform/index.js';
import { balancedLines, type Harmonic } from './synthetic.js';

// fft.js is the independent reference: a general-purpose radix-4 FFT from npm.
const FFT_SIZE = 4096;
const ELECTRICAL_HZ = 100;
const HARMONICS: Harmonic[] = [
  { order: 1, amplitudeV: 100 },
  { order: 5, amplitudeV: 3, phaseRad: 0.4 },
  { order: 7, amplitudeV: 1.5, phaseRad: -1.1 },
  { order: 11, amplitudeV: 0.8, phaseRad: 2 },
];

interface Bin {
  amplitude: number;
  phaseRad: number;
}

/** Single-sided amplitude 2|X_k|/N and phase of every bin up to Nyquist, by fft.js. */
function fftBins(x: Float64Array): Bin[] {
  const fft = new FFT(x.length);
  const out: number[] = fft.createComplexArray();
  fft.realTransform(out, x);
  return Array.from({ length: x.length / 2 }, (_, k) => ({
    amplitude: (2 * Math.hypot(out[2 * k], out[2 * k + 1])) / x.length,
    phaseRad: Math.atan2(out[2 * k + 1], out[2 * k]),
  }));
}

describe('analyzeBackEmf against fft.js on a coherently sampled record', () => {
  // 16 whole cycles in 4096 samples: every harmonic sits on a bin, where a plain FFT is exact.
  const cycles = 16;
  const sampleRateHz = (FFT_SIZE * ELECTRICAL_HZ) / cycles;
  const lines = balancedLines({ sampleRateHz, electricalHz: ELECTRICAL_HZ, samples: FFT_SIZE, harmonics: HARMONICS, dcV: 2 });
  const result = analyzeBackEmf({ sampleRateHz, speedRpm: 1000, polePairs: 6, lineToLineV: lines });
  const bins = { uv: fftBins(lines.uv), vw: fftBins(lines.vw), wu: fftBins(lines.wu) };

  it('when every harmonic is bin-centred, then the harmonic percentages agree with fft.js bins to 1e-6', () => {
    expect(result.cycles).toBe(cycles);
    for (const line of ['uv', 'vw', 'wu'] as const) {
      const fundamental = bins[line][cycles].amplitude;
      for (let order = 2; order <= 25; order++) {
        const reference = (100 * bins[line][cycles * order].amplitude) / fundamental;
        const ours = result.harmonicsPercent[line][order];
        if (reference > 0.1) expect(Math.abs(ours / reference - 1)).toBeLessThan(1e-6);
        else expect(Math.abs(ours - reference)).toBeLessThan(1e-6);
      }
    }
  });

  it('when Ke and THD are formed, then they agree with the same quantities from fft.js bins to 1e-6', () => {
    const fundamentalRms = (['uv', 'vw', 'wu'] as const).map((line) => bins[line][cycles].amplitude / Math.SQRT2);
    const keReference = fundamentalRms.reduce((a, b) => a + b, 0) / 3 / (1000 / 1000);
    expect(Math.abs(result.keVPerKrpm / keReference - 1)).toBeLessThan(1e-6);
    for (const line of ['uv', 'vw', 'wu'] as const) {
      // IEEE Std 519-2014 THD from the reference bins, h = 2…25
      let squares = 0;
      for (let order = 2; order <= 25; order++) squares += bins[line][cycles * order].amplitude ** 2;
      const thdReference = (100 * Math.sqrt(squares)) / bins[line][cycles].amplitude;
      expect(Math.abs(result.thdPercent[line] / thdReference - 1)).toBeLessThan(1e-6);
    }
  });

  it('when the RMS is taken, then it agrees with Parseval’s theorem over the fft.js spectrum', () => {
    // Parseval: mean square about DC = Σ_{k≥1} (single-sided amplitude)²/2 for a periodic record
    for (const line of ['uv', 'vw', 'wu'] as const) {
      const meanSquare = bins[line].slice(1).reduce((sum, bin) => sum + bin.amplitude ** 2 / 2, 0);
      expect(Math.abs(result.rmsV[line] / Math.sqrt(meanSquare) - 1)).toBeLessThan(1e-9);
    }
  });

  it('when phase spacing is measured, then it agrees with the fft.js bin phases', () => {
    const deg = (rad: number) => (((rad * 180) / Math.PI) % 360 + 360) % 360;
    const phase = (line: 'uv' | 'vw' | 'wu') => bins[line][cycles].phaseRad;
    expect(result.phaseSpacingDeg.uvToVw).toBeCloseTo(deg(phase('uv') - phase('vw')), 6);
    expect(result.phaseSpacingDeg.vwToWu).toBeCloseTo(deg(phase('vw') - phase('wu')), 6);
    expect(result.phaseSpacingDeg.wuToUv).toBeCloseTo(deg(phase('wu') - phase('uv')), 6);
  });
});

describe('analyzeBackEmf against fft.js on a record of 16.5 cycles', () => {
  // Half a bin off: the case where a plain FFT bin is worst (Harris 1978, scalloping loss).
  const cycles = 16.5;
  const sampleRateHz = (FFT_SIZE * ELECTRICAL_HZ) / cycles;
  const lines = balancedLines({ sampleRateHz, electricalHz: ELECTRICAL_HZ, samples: FFT_SIZE, harmonics: HARMONICS });
  const result = analyzeBackEmf({ sampleRateHz, speedRpm: 1000, polePairs: 6, lineToLineV: lines });
  const bins = fftBins(lines.uv);

  it('when the fundamental falls between bins, then the best fft.js bin loses about 36 % of it', () => {
    // Harris 1978: rectangular-window scalloping loss at half a bin is sinc(½) = 2/π (−3.92 dB)
    const naive = Math.max(bins[16].amplitude, bins[17].amplitude);
    expect(1 - naive / 100).toBeGreaterThan(0.3);
    expect(naive / 100).toBeCloseTo(2 / Math.PI, 1);
  });

  it('when the same record is analysed, then the fundamental and the 5th stay within 0.1 %', () => {
    // Ke at 1000 rpm is the fundamental's RMS, 100/√2 V (Ke = V_LL,rms/(n/1000), DOMAIN)
    expect(Math.abs(result.keVPerKrpm / (100 / Math.SQRT2) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(result.harmonicsPercent.uv[5] / 3 - 1)).toBeLessThan(1e-3);
    // the naive 5th-harmonic bin (82 or 83 for 82.5) is off by far more
    const naiveFifth = (100 * Math.max(bins[82].amplitude, bins[83].amplitude)) / Math.max(bins[16].amplitude, bins[17].amplitude);
    expect(Math.abs(naiveFifth / 3 - 1)).toBeGreaterThan(0.01);
    expect(result.cycles).toBe(16);
  });
});
