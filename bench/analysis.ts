// Benchmark hook for the engineering core: analyzeBackEmf on 3 × 100k samples (target ≤ 20 ms)
// beside the bare fft.js transform of the same three channels, the ceiling no analysis that
// looks at the spectrum can beat. The lead wires benchAnalysis() into bench/run.ts.
import FFT from 'fft.js';
import { analyzeBackEmf } from '../server/analysis/index.js';
import { medianMs } from './stats.js';

const SAMPLES_PER_PHASE = 100_000;
const SAMPLE_RATE_HZ = 200_000;
const SPEED_RPM = 3000;
const POLE_PAIRS = 4;

/** Three line-to-line voltages with 5th and 7th harmonics and a little deterministic noise. */
function spinRecord(): { uv: Float64Array; vw: Float64Array; wu: Float64Array } {
  const omega = (2 * Math.PI * POLE_PAIRS * SPEED_RPM) / 60 / SAMPLE_RATE_HZ;
  const line = (shiftRad: number) => Float64Array.from({ length: SAMPLES_PER_PHASE }, (_, n) => {
    const theta = omega * n + shiftRad;
    // A fixed pseudo-random dither (sine hash) so every run measures the same data.
    const noise = 0.05 * (Math.sin(n * 12.9898) * 43758.5453 % 1);
    return 200 * Math.sin(theta) + 4 * Math.sin(5 * theta) + 2 * Math.sin(7 * theta) + noise;
  });
  return { uv: line(Math.PI / 6), vw: line(Math.PI / 6 - (2 * Math.PI) / 3), wu: line(Math.PI / 6 + (2 * Math.PI) / 3) };
}

export async function benchAnalysis(): Promise<{ analyzeBackEmfMedianMs: number; bareFftMedianMs: number; samplesPerPhase: number }> {
  const lineToLineV = spinRecord();
  const analyzeBackEmfMedianMs = await medianMs(() => analyzeBackEmf({ sampleRateHz: SAMPLE_RATE_HZ, speedRpm: SPEED_RPM, polePairs: POLE_PAIRS, lineToLineV }));

  // The smallest power of two holding 100k samples: zero-padded, as any radix-2/4 FFT needs.
  let size = 2;
  while (size < SAMPLES_PER_PHASE) size *= 2;
  const fft = new FFT(size);
  const padded = [lineToLineV.uv, lineToLineV.vw, lineToLineV.wu].map((x) => {
    const input = new Float64Array(size);
    input.set(x);
    return input;
  });
  const output = new Float64Array(2 * size);
  const bareFftMedianMs = await medianMs(() => {
    for (const input of padded) fft.realTransform(output, input);
  });
  return { analyzeBackEmfMedianMs, bareFftMedianMs, samplesPerPhase: SAMPLES_PER_PHASE };
}
