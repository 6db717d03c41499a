import { requireNonNegative, requireOneOf, requireTemperatureC } from './validate.js';

export type ConductorMaterial = 'copper' | 'aluminium';

const materials: readonly ConductorMaterial[] = ['copper', 'aluminium'];

/**
 * Inferred zero-resistance temperature magnitude k [°C], IEC 60034-1 and IEC 60034-2-1.
 * IEEE Std 118 uses 234.5 for annealed copper; Fluxtrail follows IEC so results match IEC reports.
 */
const ZERO_RESISTANCE_TEMP_C: Record<ConductorMaterial, number> = { copper: 235, aluminium: 225 };

/**
 * Winding resistance referred to another temperature, IEC 60034-1 / IEC 60034-2-1:
 * R_ref = R_t·(k + θ_ref)/(k + θ_t), with k = 235 for copper and 225 for aluminium.
 * (IEEE Std 118 writes the same relation with k = 234.5 for copper.)
 */
export function windingResistanceAt(input: {
  resistanceOhm: number;
  measuredTempC: number;
  referenceTempC: number;
  material: ConductorMaterial;
}): number {
  const resistanceOhm = requireNonNegative('resistanceOhm', input.resistanceOhm);
  const measuredTempC = requireTemperatureC('measuredTempC', input.measuredTempC);
  const referenceTempC = requireTemperatureC('referenceTempC', input.referenceTempC);
  const k = ZERO_RESISTANCE_TEMP_C[requireOneOf('material', input.material, materials)];
  return (resistanceOhm * (k + referenceTempC)) / (k + measuredTempC);
}
