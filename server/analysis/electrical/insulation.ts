import { requireNonNegative, requireOneOf, requirePositive, requireTemperatureC } from './validate.js';

/*
 * Insulation resistance (IR) of a winding to frame at a DC test voltage, per IEEE Std 43-2013.
 * Safety: the test applies a dangerous DC voltage. Fluxtrail only records and judges the results;
 * how the test is performed is governed by site electrical-safety procedures and local codes.
 */

export type InsulationClass = 'A' | 'B' | 'F' | 'H';
export type WindingConstruction = 'random' | 'form';

const insulationClasses: readonly InsulationClass[] = ['A', 'B', 'F', 'H'];
const windingConstructions: readonly WindingConstruction[] = ['random', 'form'];

/** Above this 1-min reading the absorption current is too small to measure well (IEEE Std 43-2013). */
const PI_MEANINGFUL_MAX_MEGOHM = 5000;

/**
 * Insulation resistance corrected to 40 °C, IEEE Std 43-2013 §6.3: R₄₀ = K_T·R_T with
 * K_T = 0.5^((40 − T)/10), i.e. IR halves for every 10 °C rise. The 2013 edition also gives
 * material-specific factors (thermoplastic / thermosetting) that Fluxtrail does not apply; any
 * correction is least trustworthy far from 40 °C, so trend readings taken at similar temperatures.
 * Safety: Fluxtrail records and judges; site electrical-safety procedures and local codes govern the test.
 */
export function insulationResistanceAt40C(input: {
  resistanceMegohm: number;
  windingTempC: number;
}): number {
  const resistanceMegohm = requireNonNegative('resistanceMegohm', input.resistanceMegohm);
  const windingTempC = requireTemperatureC('windingTempC', input.windingTempC);
  return resistanceMegohm * 0.5 ** ((40 - windingTempC) / 10);
}

/**
 * Polarization index PI = R₁₀min / R₁min (IEEE Std 43-2013 §5.4). Both readings at the same
 * test voltage and temperature, so no temperature correction is needed.
 * Safety: Fluxtrail records and judges; site electrical-safety procedures and local codes govern the test.
 */
export function polarizationIndex(input: { r1MinMegohm: number; r10MinMegohm: number }): number {
  const r1MinMegohm = requirePositive('r1MinMegohm', input.r1MinMegohm);
  const r10MinMegohm = requireNonNegative('r10MinMegohm', input.r10MinMegohm);
  return r10MinMegohm / r1MinMegohm;
}

/**
 * Dielectric absorption ratio DAR = R₆₀s / R₃₀s: a short-time cousin of PI for production lines.
 * IEEE Std 43-2013 sets no minimum for it; about 1.4–1.6 is typical (from memory).
 * Safety: Fluxtrail records and judges; site electrical-safety procedures and local codes govern the test.
 */
export function dielectricAbsorptionRatio(input: { r30sMegohm: number; r60sMegohm: number }): number {
  const r30sMegohm = requirePositive('r30sMegohm', input.r30sMegohm);
  const r60sMegohm = requireNonNegative('r60sMegohm', input.r60sMegohm);
  return r60sMegohm / r30sMegohm;
}

/**
 * Recommended minimum PI by thermal class, IEEE Std 43-2013 §12.2: 1.5 for class A, 2.0 for
 * classes B, F and H (clause number from memory).
 */
export function polarizationIndexMinimum(insulationClass: InsulationClass): number {
  requireOneOf('insulationClass', insulationClass, insulationClasses);
  return insulationClass === 'A' ? 1.5 : 2.0;
}

/**
 * Whether a PI judgement is meaningful: IEEE Std 43-2013 (§12.2, from memory) lets the PI be disregarded when the
 * 1-min IR (corrected to 40 °C) is above 5000 MΩ, because the currents are then at the edge of what
 * the instrument resolves.
 */
export function polarizationIndexMeaningful(r1MinMegohm: number): boolean {
  requireNonNegative('r1MinMegohm', r1MinMegohm);
  return r1MinMegohm <= PI_MEANINGFUL_MAX_MEGOHM;
}

/**
 * Recommended minimum 1-min IR corrected to 40 °C, IEEE Std 43-2013 §12.3 (table of recommended
 * minimum values): 100 MΩ for form-wound windings built after about 1970 and rated 1 kV and above;
 * 5 MΩ for random-wound windings and for form-wound windings below 1 kV. Older windings (before
 * about 1970) use kV + 1 MΩ instead: see {@link minimumInsulationResistanceLegacyMegohm}.
 */
export function minimumInsulationResistanceMegohm(input: {
  ratedVoltageV: number;
  winding: WindingConstruction;
}): number {
  const ratedVoltageV = requirePositive('ratedVoltageV', input.ratedVoltageV);
  const winding = requireOneOf('winding', input.winding, windingConstructions);
  return winding === 'form' && ratedVoltageV >= 1000 ? 100 : 5;
}

/**
 * Recommended minimum 1-min IR at 40 °C for most windings made before about 1970, IEEE Std 43-2013
 * §12.3: kV + 1 MΩ, with kV the rated line-to-line voltage in kilovolts.
 */
export function minimumInsulationResistanceLegacyMegohm(ratedVoltageV: number): number {
  requirePositive('ratedVoltageV', ratedVoltageV);
  return ratedVoltageV / 1000 + 1;
}
