import { requirePositive } from './validate.js';

/*
 * Dielectric withstand (hipot) test voltages, winding to frame, per IEC 60034-1 Table 16.
 * Safety: hipot applies a lethal voltage. Fluxtrail only records and judges the results; how the
 * test is performed is governed by site electrical-safety procedures and local codes.
 */

export interface HipotVoltage {
  acVrms: number;
  durationS: number;
  source: string;
}

export interface HipotTestVoltage extends HipotVoltage {
  production: HipotVoltage;
}

/** Table 16 rows beyond this output are voltage-banded and agreed case by case. */
const TABLE_16_MAX_POWER_KW = 10_000;
const SHORTENED_TEST_FACTOR = 1.2;

/**
 * Type/acceptance hipot voltage, IEC 60034-1 Table 16 (items 1 and 2): rated output below 1 kW and
 * rated voltage below 100 V → 500 V + 2·U_N; otherwise, below 10 000 kW, 1000 V + 2·U_N with a
 * minimum of 1500 V; AC RMS at power frequency for 60 s. `production` is the shortened routine
 * test of 1 s at 120 % of that voltage that IEC 60034-1 §9.2 allows for series machines up to
 * 200 kW and 1 kV (from memory; check the edition in force before relying on the scope).
 * Safety: Fluxtrail records and judges; site electrical-safety procedures and local codes govern the test.
 */
export function hipotTestVoltage(input: { ratedVoltageV: number; ratedPowerKw: number }): HipotTestVoltage {
  const ratedVoltageV = requirePositive('ratedVoltageV', input.ratedVoltageV);
  const ratedPowerKw = requirePositive('ratedPowerKw', input.ratedPowerKw);
  if (ratedPowerKw >= TABLE_16_MAX_POWER_KW) {
    throw new Error(
      `ratedPowerKw must be below ${TABLE_16_MAX_POWER_KW} kW: the IEC 60034-1 Table 16 rows for larger machines are out of scope, got ${ratedPowerKw}`,
    );
  }
  const smallLowVoltage = ratedPowerKw < 1 && ratedVoltageV < 100;
  const acVrms = smallLowVoltage
    ? 500 + 2 * ratedVoltageV
    : Math.max(1500, 1000 + 2 * ratedVoltageV);
  return {
    acVrms,
    durationS: 60,
    source: smallLowVoltage ? 'IEC 60034-1 Table 16 item 1' : 'IEC 60034-1 Table 16 item 2',
    production: {
      acVrms: acVrms * SHORTENED_TEST_FACTOR,
      durationS: 1,
      source: 'IEC 60034-1 §9.2 shortened routine test, from memory',
    },
  };
}

/**
 * Voltage for a repeated withstand test on the same winding: 80 % of the original test voltage,
 * because every full-voltage test ages the insulation (common practice).
 * Safety: Fluxtrail records and judges; site electrical-safety procedures and local codes govern the test.
 */
export function hipotRepeatTestVoltage(acVrms: number): number {
  return 0.8 * requirePositive('acVrms', acVrms);
}

/**
 * DC test voltage equivalent to an AC RMS hipot voltage: 1.7 × AC RMS, a little above the √2 peak
 * to allow for the different stress distribution under DC (common practice).
 * Safety: Fluxtrail records and judges; site electrical-safety procedures and local codes govern the test.
 */
export function hipotDcEquivalentV(acVrms: number): number {
  return 1.7 * requirePositive('acVrms', acVrms);
}
