import { requireOneOf, requirePositive } from './validate.js';

export type BusKind = 'dc' | 'ac';

const busKinds: readonly BusKind[] = ['dc', 'ac'];

/** Minimum isolation per volt of working voltage, UNECE R100 and ISO 6469-3. */
const OHM_PER_VOLT: Record<BusKind, number> = { dc: 100, ac: 500 };

/**
 * Minimum isolation resistance of a vehicle high-voltage bus to the electrical chassis,
 * UNECE Regulation No. 100 (Rev. 2 §5.1.3, from memory) and ISO 6469-3: 100 Ω per volt of working
 * voltage for DC buses, 500 Ω/V for AC buses (an AC bus that is not otherwise protected).
 * Safety: isolation is measured on energized or charged systems. Fluxtrail only records and judges
 * the results; site electrical-safety procedures and local codes govern the test.
 */
export function isolationResistanceMinimumOhm(input: { workingVoltageV: number; bus: BusKind }): number {
  const workingVoltageV = requirePositive('workingVoltageV', input.workingVoltageV);
  return OHM_PER_VOLT[requireOneOf('bus', input.bus, busKinds)] * workingVoltageV;
}
