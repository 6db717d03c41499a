import { hipotTestVoltage, insulationResistanceAt40C, unbalancePercent } from '../../../server/analysis/electrical/index.js';
import { atLeast, phaseResistances, round, type MotorContext, type MotorModel } from './shared.js';

const nominalKe = 48.0; // V/krpm, line-to-line RMS
const hipotV = hipotTestVoltage({ ratedVoltageV: 350, ratedPowerKw: 150 }).production.acVrms;

/**
 * The PM-150 traction motor's process: values centred inside the limits with Cpk about 1.4–2,
 * raw insulation readings corrected with IEEE 43's factor, unbalances computed per NEMA MG 1 from
 * the phase values, so the summaries a stand posts agree with each other.
 */
export function pm150Motor({ prng, lot, keDriftPct }: MotorContext): MotorModel {
  const rBase = 9.8 * (1 + lot.resistanceShiftPct / 100 + prng.normal(0, 0.008));
  const truth = {
    windingTempC: prng.normal(23.5, 1.5),
    resistances: phaseResistances(prng, rBase, 0.0025),
    crimpPhase: prng.int(0, 2), crimpRise: prng.uniform(0.035, 0.05),
    ir1MinMegohm: prng.logNormal(9000, 0.35), moistureFactor: prng.uniform(0.012, 0.02),
    dar: prng.normal(1.45, 0.05), leakageMa: atLeast(0.8, prng.normal(1.9, 0.22)), contaminatedMa: prng.uniform(3.3, 4.6),
    ke: nominalKe * (1 + (lot.keShiftPct + keDriftPct) / 100 + prng.normal(0, 0.0065)),
    lineWeights: [0, 1, 2].map(() => 1 + prng.normal(0, 0.0015)),
    weakLine: prng.int(0, 2), magnetLoss: prng.uniform(0.035, 0.055),
    thdPercent: atLeast(0.4, prng.normal(1.45, 0.25)),
    spacingDeg: [0, 1, 2].map(() => prng.normal(0, 0.15)),
    resolverDeg: prng.normal(12 + lot.resolverShiftDeg, 0.85), resolverError: prng.pick([-1, 1]) * prng.uniform(5.5, 8),
    ldUh: prng.normal(152, 3), lqUh: prng.normal(398, 7), noLoadA: prng.normal(8.4, 0.6),
    noiseDba: prng.normal(71, 1.2), vibrationMmS: atLeast(0.3, prng.normal(1.1, 0.3)),
    bearingNoiseDba: prng.uniform(77, 80), bearingVibrationMmS: prng.uniform(3.0, 4.2),
  };
  return {
    measure(faults) {
      const tempC = truth.windingTempC + prng.normal(0, 0.1);
      const resistances = truth.resistances.map((r, phase) =>
        r * (1 + prng.normal(0, 0.0008)) * (faults.has('crimp') && phase === truth.crimpPhase ? 1 + truth.crimpRise : 1));
      const ir1Min = truth.ir1MinMegohm * (1 + prng.normal(0, 0.03)) * (faults.has('moisture') ? truth.moistureFactor : 1);
      const lines = truth.lineWeights.map((w, line) =>
        truth.ke * w * (1 + prng.normal(0, 0.0005)) * (faults.has('damaged-magnet') && line === truth.weakLine ? 1 - truth.magnetLoss : 1));
      const swapped = faults.has('swapped-sequence');
      const spacing = swapped ? 120 + prng.normal(0, 0.1) : Math.max(...truth.spacingDeg.map((d) => Math.abs(d + prng.normal(0, 0.03))));
      const bearing = faults.has('bearing');
      return {
        winding_temp: round(tempC, 1),
        r_u_20c: round(resistances[0], 3), r_v_20c: round(resistances[1], 3), r_w_20c: round(resistances[2], 3),
        r_unbalance: round(unbalancePercent(resistances), 3),
        ir_40c: round(insulationResistanceAt40C({ resistanceMegohm: ir1Min, windingTempC: tempC }), 0),
        dar: round(faults.has('moisture') ? prng.uniform(1.02, 1.12) : truth.dar + prng.normal(0, 0.01), 2),
        hipot_voltage: round(prng.normal(hipotV, 4), 0),
        hipot_leakage: round(faults.has('contamination') ? truth.contaminatedMa : truth.leakageMa + prng.normal(0, 0.03), 2),
        ke: round(lines.reduce((sum, v) => sum + v, 0) / lines.length, 3),
        emf_frequency: round(prng.normal(66.667, 0.015), 3),
        emf_thd: round(truth.thdPercent + prng.normal(0, 0.05) + (faults.has('damaged-magnet') ? 0.6 : 0), 2),
        emf_unbalance: round(unbalancePercent(lines), 3),
        phase_sequence: swapped ? -1 : 1,
        phase_spacing_dev: round(spacing, 2),
        resolver_offset: round(truth.resolverDeg + prng.normal(0, 0.1) + (faults.has('resolver') ? truth.resolverError : 0), 2),
        ld: round(truth.ldUh + prng.normal(0, 0.5), 1), lq: round(truth.lqUh + prng.normal(0, 1), 1),
        no_load_current: round(truth.noLoadA + prng.normal(0, 0.1), 2),
        noise: round(bearing ? truth.bearingNoiseDba : truth.noiseDba + prng.normal(0, 0.3), 1),
        vibration: round(bearing ? truth.bearingVibrationMmS : truth.vibrationMmS + prng.normal(0, 0.08), 2),
      };
    },
  };
}
