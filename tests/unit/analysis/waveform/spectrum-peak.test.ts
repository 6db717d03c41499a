import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { coarseSpectrumPeakHz } from '../../../../server/analysis/waveform/spectrum-peak.js';
import { wave } from './synthetic.js';

describe('coarseSpectrumPeakHz', () => {
  it('when a tone falls between FFT bins, then the interpolated peak is far closer than the nearest bin', () => {
    // The nearest bin can be half a bin off (Harris 1978 scalloping); Gaussian interpolation of a
    // Hann-windowed peak brings that to a few hundredths of a bin (common practice).
    const sampleRateHz = 10_000;
    const samples = 4096;
    const binHz = sampleRateHz / samples;
    for (const bins of [20.5, 33.25, 61.8]) {
      const x = wave({ sampleRateHz, electricalHz: bins * binHz, samples, harmonics: [{ order: 1, amplitudeV: 1 }] });
      const offsetBins = Math.abs(coarseSpectrumPeakHz(x, sampleRateHz, 'x') / binHz - bins);
      expect(offsetBins).toBeLessThan(0.05);
    }
  });

  it('when the record is long, then block averaging keeps the peak where fft.js finds it on all samples', () => {
    // Reference: the largest bin of a plain fft.js transform of the whole 2^17-sample record.
    const sampleRateHz = 50_000;
    const samples = 131_072;
    const x = wave({ sampleRateHz, electricalHz: 211.7, samples, harmonics: [{ order: 1, amplitudeV: 1 }, { order: 5, amplitudeV: 0.05 }], dcV: 3 });
    const fft = new FFT(samples);
    const out: number[] = fft.createComplexArray();
    fft.realTransform(out, x);
    let peak = 1;
    for (let k = 2; k < samples / 2; k++) {
      if (Math.hypot(out[2 * k], out[2 * k + 1]) > Math.hypot(out[2 * peak], out[2 * peak + 1])) peak = k;
    }
    const binHz = sampleRateHz / samples;
    expect(Math.abs(coarseSpectrumPeakHz(x, sampleRateHz, 'x') - peak * binHz)).toBeLessThan(binHz);
  });

  it('when the record is constant, then it throws naming the argument', () => {
    expect(() => coarseSpectrumPeakHz(new Float64Array(1000).fill(2), 1000, 'lineToLineV')).toThrow(/lineToLineV shows no fundamental/);
  });
});
