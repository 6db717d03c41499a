import FFT from 'fft.js';
import { hannSpan } from './hann-span.js';

/**
 * Coarse location of the fundamental: the largest peak of a Hann-windowed FFT. It only has to
 * land within a fraction of a bin; the precise frequency comes from the phase refinement in
 * fundamental-frequency.ts.
 */

// Long records are block-averaged towards this many points before the FFT: the coarse peak
// needs the record's duration (its frequency resolution), not every sample. Blocks of at most
// four samples keep every fundamental below sampleRateHz/8 in band.
const TARGET_FFT_POINTS = 16384;
const MAX_BLOCK_SAMPLES = 4;

// Building an FFT's twiddle and bit-reversal tables costs more than the transform itself, so
// each size is built once. The tables are read-only, which keeps the function pure.
const fftBySize = new Map<number, FFT>();

// The search starts one cycle per record up: below that the Hann main lobe of the fundamental
// merges with what is left of DC. A record of two cycles puts its peak at two.
const MIN_CYCLES_PER_RECORD = 1;

/**
 * Frequency of the largest spectral peak, in Hz: mean removed, Hann window (Harris 1978), FFT by
 * fft.js with zero padding to a power of two, peak bin refined by fitting a parabola to the
 * logarithm of the three bins around it (Gaussian interpolation, common practice; its bias for a
 * Hann window is a few hundredths of a bin).
 * A long record is first averaged in blocks of D ≤ 4 samples, which keeps every fundamental
 * below sampleRateHz/(2D) in band: the fundamental needs at least 8 samples a cycle (the
 * back-EMF analysis requires 50, for its 25th harmonic).
 */
export function coarseSpectrumPeakHz(x: Float64Array, sampleRateHz: number, name: string): number {
  const blockSize = Math.min(MAX_BLOCK_SAMPLES, Math.ceil(x.length / TARGET_FFT_POINTS));
  const points = Math.floor(x.length / blockSize);
  const decimated = new Float64Array(points);
  let mean = 0;
  for (let i = 0; i < points; i++) {
    let sum = 0;
    for (let j = 0; j < blockSize; j++) sum += x[i * blockSize + j];
    decimated[i] = sum / blockSize;
    mean += decimated[i] / points;
  }
  let fftSize = 2;
  while (fftSize < points) fftSize *= 2;
  const { weights } = hannSpan(0, points, points);
  const windowed = new Float64Array(fftSize);
  for (let i = 0; i < points; i++) windowed[i] = (decimated[i] - mean) * weights[i];
  let fft = fftBySize.get(fftSize);
  if (!fft) {
    fft = new FFT(fftSize);
    fftBySize.set(fftSize, fft);
  }
  // fft.js only indexes its output, so a typed array serves and saves building a plain one.
  const spectrum = new Float64Array(2 * fftSize);
  fft.realTransform(spectrum, windowed);

  const power = new Float64Array(fftSize / 2);
  for (let k = 0; k < power.length; k++) power[k] = spectrum[2 * k] ** 2 + spectrum[2 * k + 1] ** 2;
  const binsPerCycle = fftSize / points;
  const lowest = Math.max(1, Math.ceil(MIN_CYCLES_PER_RECORD * binsPerCycle));
  let peak = lowest;
  for (let k = lowest + 1; k < power.length; k++) {
    if (power[k] > power[peak]) peak = k;
  }
  // A maximum on the lower edge that still falls towards DC is a real peak; one that rises
  // towards DC is the tail of DC or of a record too short to show its fundamental.
  const risesTowardsDc = peak === lowest && power[peak - 1] >= power[peak];
  if (risesTowardsDc || peak >= power.length - 1 || !(power[peak] > 0)) {
    throw new Error(
      `${name} shows no fundamental: the record must hold at least two electrical cycles of an alternating voltage`,
    );
  }
  // Logarithms of powers: the factor 2 against log-magnitudes cancels in the ratio.
  const below = Math.log(power[peak - 1]);
  const at = Math.log(power[peak]);
  const above = Math.log(power[peak + 1]);
  const offsetBins = (0.5 * (below - above)) / (below - 2 * at + above);
  // A neighbour of exactly zero (a bin-centred tone) leaves the peak bin itself as the estimate.
  const interpolated = peak + (Number.isFinite(offsetBins) ? offsetBins : 0);
  return (interpolated * sampleRateHz) / (blockSize * fftSize);
}
