import { formatNumber } from '../../../lib/format';
import type { Measurement } from '../api/motor-schemas';

type Limits = Pick<Measurement, 'lsl' | 'usl' | 'unit'>;

/** A ratio's unit "1" (SI for dimensionless) is left off: "1.46", not "1.46 1". */
export const displayUnit = (unit: string | null | undefined): string | undefined =>
  unit && unit !== '1' ? unit : undefined;

const present = (limit: number | null | undefined): limit is number => limit !== null && limit !== undefined;

/** "1.20 … 1.45 Ω" for two-sided limits, "≥ 100 MΩ" or "≤ 5 mA" for one-sided ones. */
export function formatLimits({ lsl, usl, unit }: Limits): string {
  const withUnit = (value: number) => formatNumber(value, { unit: displayUnit(unit) });
  if (present(lsl) && present(usl)) return lsl === usl ? `= ${withUnit(lsl)}` : `${formatNumber(lsl)} … ${withUnit(usl)}`;
  if (present(lsl)) return `≥ ${withUnit(lsl)}`;
  if (present(usl)) return `≤ ${withUnit(usl)}`;
  return 'no limit';
}

export type BarScale = {
  /** Positions as 0…100 % of the bar's width; undefined when that limit does not exist. */
  lslAt?: number;
  uslAt?: number;
  valueAt: number;
};

/**
 * Places a value and its limits on one bar. Two-sided: the limits sit at 20 % and 80 % so a value
 * just outside still shows. One-sided: the single limit sits mid-bar and the value left or right of it.
 */
export function barScale({ value, lsl, usl }: Pick<Measurement, 'value' | 'lsl' | 'usl'>): BarScale | undefined {
  const clamp = (at: number) => Math.min(100, Math.max(0, at));
  if (present(lsl) && present(usl) && usl > lsl) {
    const span = usl - lsl;
    const at = (x: number) => clamp(20 + ((x - lsl) / span) * 60);
    return { lslAt: at(lsl), uslAt: at(usl), valueAt: at(value) };
  }
  const limit = present(lsl) ? lsl : present(usl) ? usl : undefined;
  if (limit === undefined) return undefined;
  const reach = Math.max(Math.abs(value - limit) * 1.25, Math.abs(limit) * 0.5, 1e-9);
  const at = (x: number) => clamp(50 + ((x - limit) / reach) * 50);
  return present(lsl) ? { lslAt: 50, valueAt: at(value) } : { uslAt: 50, valueAt: at(value) };
}

const highVoltagePattern = /hipot|insulation|polari[sz]ation|dielectric/i;

/** Hipot and insulation steps apply hazardous voltages; screens that show them carry the caution. */
export function isHighVoltageResult(result: Pick<Measurement, 'characteristic' | 'name' | 'testStep'>): boolean {
  return [result.characteristic, result.name, result.testStep ?? ''].some((text) => highVoltagePattern.test(text));
}
