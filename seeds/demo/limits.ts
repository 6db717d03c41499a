import { hipotTestVoltage } from '../../server/analysis/electrical/index.js';
import type { LimitRowInput } from '../../server/schemas/setup.js';
import type { DemoProductCode } from './products.js';

type Bounds = [lsl: number | null, nominal: number | null, usl: number | null];

const rows = (bounds: Record<string, Bounds>): LimitRowInput[] =>
  Object.entries(bounds).map(([characteristicCode, [lsl, nominal, usl]]) => ({ characteristicCode, lsl, nominal, usl }));

const percentAround = (nominal: number, percent: number, decimals: number): Bounds => {
  const round = (value: number) => Number(value.toFixed(decimals));
  return [round(nominal * (1 - percent / 100)), nominal, round(nominal * (1 + percent / 100))];
};

/** The stand's applied voltage is judged within ±1 % of the IEC 60034-1 shortened routine test voltage. */
const hipotVoltage = (ratedVoltageV: number, ratedPowerKw: number): Bounds =>
  percentAround(hipotTestVoltage({ ratedVoltageV, ratedPowerKw }).production.acVrms, 1, 0);

const windingChecks = (nominalR: number, decimals: number): Record<string, Bounds> => ({
  winding_temp: [15, null, 35],
  r_u_20c: percentAround(nominalR, 5, decimals),
  r_v_20c: percentAround(nominalR, 5, decimals),
  r_w_20c: percentAround(nominalR, 5, decimals),
  r_unbalance: [null, null, 2.0], // random-wound (common practice)
});

const pmRevision1: Record<string, Bounds> = {
  ...windingChecks(9.8, 2),
  ir_40c: [100, null, null], // plant rule, stricter than IEEE 43's 5 MΩ for random-wound windings
  dar: [1.2, null, null],
  hipot_voltage: hipotVoltage(350, 150),
  hipot_leakage: [null, null, 3.0],
  ke: percentAround(48.0, 5, 2),
  emf_frequency: percentAround(66.667, 1, 2), // 4 pole pairs × 1000 rpm / 60
  emf_thd: [null, null, 3.0],
  emf_unbalance: [null, null, 1.0],
  phase_sequence: [1, 1, 1],
  phase_spacing_dev: [null, 0, 1.0],
  resolver_offset: [7.0, 12.0, 17.0],
  ld: percentAround(152, 10, 0),
  lq: percentAround(398, 10, 0),
  no_load_current: [null, null, 11.0],
  noise: [null, null, 76.0],
  vibration: [null, null, 2.8],
};

/** Revision 2 tightens Ke from ±5 % to ±4 % after the inverter calibration study. */
const pmRevision2 = { ...pmRevision1, ke: percentAround(48.0, 4, 2) };
/** Draft revision 3 proposes a tighter THD and noise limit; it waits for a second quality user. */
const pmRevision3 = { ...pmRevision2, emf_thd: [null, null, 2.5] as Bounds, noise: [null, null, 75.0] as Bounds };

const imRevision1: Record<string, Bounds> = {
  ...windingChecks(1.85, 3),
  ir_40c: [20, null, null],
  hipot_voltage: hipotVoltage(400, 7.5),
  hipot_leakage: [null, null, 1.5],
  no_load_current: [5.2, 6.2, 7.2],
  rated_speed: [1435, 1450, 1465],
  slip: [2.33, 3.33, 4.33],
  vibration: [null, null, 2.3],
  noise: [null, null, 69.0],
};

const dcRevision1: Record<string, Bounds> = {
  winding_temp: [15, null, 35],
  armature_r_20c: percentAround(0.24, 8, 4),
  ir_40c: [10, null, null],
  hipot_voltage: hipotVoltage(24, 0.2),
  hipot_leakage: [null, null, 0.5],
  ke: percentAround(6.9, 5, 3),
  no_load_speed: [3150, 3300, 3450],
  no_load_current: [0.4, 0.8, 1.3],
};

export type DemoLimitRevision = {
  productCode: DemoProductCode;
  limits: LimitRowInput[];
  note: string;
  /** Days before the demo's "today": authored, approved (absent for a draft) and in force from. */
  authoredDaysAgo: number;
  approval?: { daysAgo: number; effectiveDaysAgo: number; reason: string };
};

/** In revision order per product, as the plant's quality engineers wrote and approved them. */
export const demoLimitRevisions: readonly DemoLimitRevision[] = [
  { productCode: 'PM-150', limits: rows(pmRevision1), note: 'Initial release for series production', authoredDaysAgo: 64,
    approval: { daysAgo: 62, effectiveDaysAgo: 60, reason: 'PPAP run passed; released for series production' } },
  { productCode: 'IM-4P', limits: rows(imRevision1), note: 'Initial release for series production', authoredDaysAgo: 64,
    approval: { daysAgo: 62, effectiveDaysAgo: 60, reason: 'Released for series production' } },
  { productCode: 'DC-24A', limits: rows(dcRevision1), note: 'Initial release for series production', authoredDaysAgo: 64,
    approval: { daysAgo: 62, effectiveDaysAgo: 60, reason: 'Released for series production' } },
  { productCode: 'PM-150', limits: rows(pmRevision2), note: 'Ke tolerance ±4 % (was ±5 %)', authoredDaysAgo: 23,
    approval: { daysAgo: 21, effectiveDaysAgo: 20, reason: 'Inverter torque accuracy needs Ke within ±4 %; study QS-0419' } },
  { productCode: 'PM-150', limits: rows(pmRevision3), note: 'Proposal: THD ≤ 2.5 %, noise ≤ 75 dB(A)', authoredDaysAgo: 1 },
];
