import type { BackEmfWaveformInput, ReadingInput } from '../../server/schemas/raw-data.js';
import type { ResultInput } from '../../server/schemas/test-run.js';
import type { Prng } from './prng.js';

/**
 * Raw data for a demo PM-150 run, built backwards from the values its motor model simulated, so
 * that Fluxtrail's own analysis of the raw data gives those values back (to within the noise):
 * a back-EMF spin with the resolver sampled alongside, and the insulation, hipot and winding
 * resistance readings. The derivable results are then taken out of the posted results, because
 * a run must not carry a value and the raw data for one characteristic (derive-characteristics.ts).
 */
const SAMPLE_RATE_HZ = 20_000;
const SAMPLES_PER_LINE = 4096; // ≈ 13.7 cycles at 1000 rpm: moderate, so the seed stays fast
const NOMINAL_SPEED_RPM = 1000;
const POLE_PAIRS = 4;
const NOISE_V = 0.08; // RMS noise of the stand's differential probes
const RESOLVER_LSB_DEG = 360 / 4096; // a 12-bit resolver-to-digital converter
const COPPER_K = 235; // IEC 60034-1, to read the 20 °C values back to the winding temperature

const BACK_EMF_CODES = ['ke', 'emf_frequency', 'emf_thd', 'emf_unbalance', 'phase_sequence', 'phase_spacing_dev', 'resolver_offset'];
const READING_CODES = ['ir_40c', 'dar', 'r_u_20c', 'r_v_20c', 'r_w_20c', 'r_unbalance'];

export type DemoRawData = { results: ResultInput[]; waveforms: BackEmfWaveformInput[]; readings: ReadingInput[] };

export function demoRawData(results: readonly ResultInput[], prng: Prng): DemoRawData {
  const value = (code: string) => {
    const found = results.find((r) => r.characteristic === code);
    if (!found) throw new Error(`the demo PM-150 run has no ${code} to build raw data from`);
    return found.value;
  };
  const derivable = new Set([...BACK_EMF_CODES, ...READING_CODES]);
  return {
    results: results.filter((r) => !derivable.has(r.characteristic)),
    waveforms: [backEmfSpin(value, prng)],
    readings: readings(value),
  };
}

function backEmfSpin(value: (code: string) => number, prng: Prng): BackEmfWaveformInput {
  // Actual speed from the simulated frequency at 1000 rpm: the drive holds 1000 rpm only nearly.
  const speedRpm = (NOMINAL_SPEED_RPM * value('emf_frequency')) / ((POLE_PAIRS * NOMINAL_SPEED_RPM) / 60);
  const omegaRadPerSample = (2 * Math.PI * POLE_PAIRS * speedRpm) / 60 / SAMPLE_RATE_HZ;
  // One line low by x gives NEMA MG 1 unbalance u = (2x/3)/(1 − x/3), so x = 3u/(2 + u); Ke is
  // the mean of the three lines, so the healthy ones stand at Ke/(1 − x/3). The stand posts its
  // set speed, so Ke refers to it while the frequency shows the drive's small speed error.
  const u = value('emf_unbalance') / 100;
  const lowLine = prng.int(0, 2);
  const lowBy = (3 * u) / (2 + u);
  const peakV = (value('ke') * (NOMINAL_SPEED_RPM / 1000) * Math.SQRT2) / (1 - lowBy / 3);
  // THD split over the 5th and 7th (0.8² + 0.6² = 1), the orders a balanced winding keeps.
  const thd = value('emf_thd') / 100;
  const reversed = value('phase_sequence') < 0;
  const shiftsRad = [30, reversed ? 150 : -90, reversed ? -90 : 150].map((deg) => (deg * Math.PI) / 180);
  const theta0 = prng.uniform(0, 2 * Math.PI);
  const line = (k: number) => Array.from({ length: SAMPLES_PER_LINE }, (_, n) => {
    const phase = theta0 + omegaRadPerSample * n + shiftsRad[k];
    const scale = k === lowLine ? 1 - lowBy : 1;
    const v = peakV * scale * (Math.sin(phase) + 0.8 * thd * Math.sin(5 * phase) + 0.6 * thd * Math.sin(7 * phase));
    return round(v + prng.normal(0, NOISE_V), 3);
  });
  const offsetDeg = value('resolver_offset');
  const resolverAngleDeg = Array.from({ length: SAMPLES_PER_LINE }, (_, n) => {
    const deg = ((theta0 + omegaRadPerSample * n) * 180) / Math.PI + offsetDeg + prng.normal(0, 0.05);
    return round(Math.round((((deg % 360) + 360) % 360) / RESOLVER_LSB_DEG) * RESOLVER_LSB_DEG % 360, 4);
  });
  return {
    kind: 'back-emf', sampleRateHz: SAMPLE_RATE_HZ, speedRpm: NOMINAL_SPEED_RPM,
    lineToLineV: { uv: line(0), vw: line(1), wu: line(2) }, resolverAngleDeg,
  };
}

/** The readings behind the 20 °C and 40 °C values: IEC 60034-1 and IEEE 43 corrections undone. */
function readings(value: (code: string) => number): ReadingInput[] {
  const tempC = value('winding_temp');
  const atTempOhm = (code: string) => round((value(code) / 1000) * (COPPER_K + tempC) / (COPPER_K + 20), 7);
  const oneMinuteMegohm = round(value('ir_40c') / 0.5 ** ((40 - tempC) / 10), 0);
  return [
    { kind: 'winding-resistance', uOhm: atTempOhm('r_u_20c'), vOhm: atTempOhm('r_v_20c'), wOhm: atTempOhm('r_w_20c'), windingTempC: tempC },
    {
      kind: 'insulation', resistanceMegohm: oneMinuteMegohm, windingTempC: tempC, testVoltageV: 1000,
      r30sMegohm: round(oneMinuteMegohm / value('dar'), 0), r60sMegohm: oneMinuteMegohm,
    },
    { kind: 'hipot', voltageV: value('hipot_voltage'), leakageMa: value('hipot_leakage'), durationS: 1, acOrDc: 'ac' },
  ];
}

function round(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}
