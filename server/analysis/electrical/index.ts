/**
 * Electrical end-of-line computations: pure functions of measured values, each returning one
 * quantity. Sources are named on each function.
 */
export {
  insulationResistanceAt40C,
  polarizationIndex,
  dielectricAbsorptionRatio,
  polarizationIndexMinimum,
  polarizationIndexMeaningful,
  minimumInsulationResistanceMegohm,
  minimumInsulationResistanceLegacyMegohm,
} from './insulation.js';
export type { InsulationClass, WindingConstruction } from './insulation.js';
export { hipotTestVoltage, hipotRepeatTestVoltage, hipotDcEquivalentV } from './hipot.js';
export type { HipotVoltage, HipotTestVoltage } from './hipot.js';
export { windingResistanceAt } from './winding-resistance.js';
export type { ConductorMaterial } from './winding-resistance.js';
export { unbalancePercent } from './unbalance.js';
export { synchronousSpeedRpm, slipPercent, electricalFrequencyHz } from './speed.js';
export { isolationResistanceMinimumOhm } from './isolation.js';
export type { BusKind } from './isolation.js';
export { keVoltSecondPerRad, torqueConstantNmPerA, keToKt } from './ke-to-kt.js';
