import { hipotTestVoltage, insulationResistanceAt40C } from '../../../server/analysis/electrical/index.js';
import { atLeast, round, type MotorContext, type MotorModel } from './shared.js';

const supplyV = 24;
const brushDropV = 1.0; // two brushes, carbon-copper grade (common practice: about 0.5 V each)
const hipotV = hipotTestVoltage({ ratedVoltageV: 24, ratedPowerKw: 0.2 }).production.acVrms;

/**
 * The DC-24A actuator's process. No-load speed follows from the motor's own Ke, armature
 * resistance and no-load current: n₀ = (U − I₀·R − U_brush) / Ke.
 */
export function dc24aMotor({ prng, lot }: MotorContext): MotorModel {
  const truth = {
    windingTempC: prng.normal(23, 1.5),
    armatureOhm: 0.24 * (1 + lot.resistanceShiftPct / 100 + prng.normal(0, 0.018)),
    ir1MinMegohm: prng.logNormal(2500, 0.4), moistureFactor: prng.uniform(0.005, 0.009),
    leakageMa: atLeast(0.03, prng.normal(0.12, 0.03)), contaminatedMa: prng.uniform(0.6, 0.9),
    ke: 6.9 * (1 + lot.keShiftPct / 100 + prng.normal(0, 0.0075)),
    noLoadA: prng.normal(0.8, 0.07), unbeddedA: prng.uniform(1.4, 1.7),
  };
  return {
    measure(faults) {
      const tempC = truth.windingTempC + prng.normal(0, 0.1);
      const ir1Min = truth.ir1MinMegohm * (1 + prng.normal(0, 0.03)) * (faults.has('moisture') ? truth.moistureFactor : 1);
      const ke = truth.ke * (1 + prng.normal(0, 0.001));
      const noLoadA = faults.has('brush') ? truth.unbeddedA : truth.noLoadA + prng.normal(0, 0.02);
      const armatureOhm = truth.armatureOhm * (1 + prng.normal(0, 0.002));
      return {
        winding_temp: round(tempC, 1),
        armature_r_20c: round(armatureOhm, 4),
        ir_40c: round(insulationResistanceAt40C({ resistanceMegohm: ir1Min, windingTempC: tempC }), 0),
        hipot_voltage: round(prng.normal(hipotV, 1.5), 0),
        hipot_leakage: round(faults.has('contamination') ? truth.contaminatedMa : truth.leakageMa + prng.normal(0, 0.01), 3),
        ke: round(ke, 3),
        no_load_speed: round(((supplyV - noLoadA * armatureOhm - brushDropV) / ke) * 1000, 0),
        no_load_current: round(noLoadA, 3),
      };
    },
  };
}
