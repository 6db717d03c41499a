import { insulationResistanceAt40C, slipPercent, synchronousSpeedRpm, unbalancePercent } from '../../../server/analysis/electrical/index.js';
import { hipotTestVoltage } from '../../../server/analysis/electrical/index.js';
import { atLeast, phaseResistances, round, type MotorContext, type MotorModel } from './shared.js';

const hipotV = hipotTestVoltage({ ratedVoltageV: 400, ratedPowerKw: 7.5 }).production.acVrms;
const synchronousRpm = synchronousSpeedRpm({ frequencyHz: 50, poles: 4 });

/** The IM-4P pump motor's process; slip is computed from the measured speed against 1500 rpm. */
export function im4pMotor({ prng, lot }: MotorContext): MotorModel {
  const rBase = 1.85 * (1 + lot.resistanceShiftPct / 100 + prng.normal(0, 0.008));
  const truth = {
    windingTempC: prng.normal(22.5, 1.8),
    resistances: phaseResistances(prng, rBase, 0.003),
    crimpPhase: prng.int(0, 2), crimpRise: prng.uniform(0.035, 0.05),
    ir1MinMegohm: prng.logNormal(4000, 0.35), moistureFactor: prng.uniform(0.006, 0.012),
    leakageMa: atLeast(0.3, prng.normal(0.85, 0.12)), contaminatedMa: prng.uniform(1.7, 2.4),
    noLoadA: prng.normal(6.2, 0.22), speedRpm: prng.normal(1450, 3.0),
    vibrationMmS: atLeast(0.2, prng.normal(0.9, 0.25)), noiseDba: prng.normal(64, 1.1),
    bearingVibrationMmS: prng.uniform(2.6, 3.5), bearingNoiseDba: prng.uniform(70, 73),
  };
  return {
    measure(faults) {
      const tempC = truth.windingTempC + prng.normal(0, 0.1);
      const resistances = truth.resistances.map((r, phase) =>
        r * (1 + prng.normal(0, 0.0008)) * (faults.has('crimp') && phase === truth.crimpPhase ? 1 + truth.crimpRise : 1));
      const ir1Min = truth.ir1MinMegohm * (1 + prng.normal(0, 0.03)) * (faults.has('moisture') ? truth.moistureFactor : 1);
      const speedRpm = round(truth.speedRpm + prng.normal(0, 0.5), 1);
      const bearing = faults.has('bearing');
      return {
        winding_temp: round(tempC, 1),
        r_u_20c: round(resistances[0], 4), r_v_20c: round(resistances[1], 4), r_w_20c: round(resistances[2], 4),
        r_unbalance: round(unbalancePercent(resistances), 3),
        ir_40c: round(insulationResistanceAt40C({ resistanceMegohm: ir1Min, windingTempC: tempC }), 0),
        hipot_voltage: round(prng.normal(hipotV, 4.5), 0),
        hipot_leakage: round(faults.has('contamination') ? truth.contaminatedMa : truth.leakageMa + prng.normal(0, 0.02), 2),
        no_load_current: round(truth.noLoadA + prng.normal(0, 0.04), 2),
        rated_speed: speedRpm,
        slip: round(slipPercent({ synchronousSpeedRpm: synchronousRpm, speedRpm }), 3),
        vibration: round(bearing ? truth.bearingVibrationMmS : truth.vibrationMmS + prng.normal(0, 0.06), 2),
        noise: round(bearing ? truth.bearingNoiseDba : truth.noiseDba + prng.normal(0, 0.3), 1),
      };
    },
  };
}
