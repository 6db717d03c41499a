import { hourMs, minuteMs, type DemoClock } from './clock.js';
import type { Prng } from './prng.js';
import type { DemoProductCode } from './products.js';
import { overdueSinceDaysAgo, overdueStationCode } from './stations.js';

/** Who stands at each line in each shift (06:00, 14:00, 22:00 UTC); two crews alternate weekly. */
const badges: Record<'A' | 'B', Record<'early' | 'late' | 'night', [string, string]>> = {
  A: { early: ['B-1042', 'B-1187'], late: ['B-1107', 'B-1266'], night: ['B-1213', 'B-1310'] },
  B: { early: ['B-2031', 'B-2194'], late: ['B-2088', 'B-2245'], night: ['B-2150', 'B-2302'] },
};

export function shiftOf(at: Date): 'early' | 'late' | 'night' {
  const hour = at.getUTCHours();
  if (hour >= 6 && hour < 14) return 'early';
  return hour >= 14 && hour < 22 ? 'late' : 'night';
}

export function operatorBadge(line: 'A' | 'B', at: Date): string {
  // The night shift belongs to the day it started on.
  const shiftDay = Math.floor((at.getTime() - 6 * hourMs) / (24 * hourMs));
  return badges[line][shiftOf(at)][Math.floor(shiftDay / 7) % 2];
}

/**
 * The stand a motor goes to: either stand of its line, except that EOL-B2 was taken out of use
 * the day after its calibration fell due (the few motors tested there anyway are planned apart).
 */
export function stationFor(line: 'A' | 'B', at: Date, clock: DemoClock, prng: Prng): string {
  if (line === 'A') return prng.pick(['EOL-A1', 'EOL-A2']);
  const overdueFrom = clock.at(overdueSinceDaysAgo - 1);
  return at < overdueFrom ? prng.pick(['EOL-B1', overdueStationCode]) : 'EOL-B1';
}

const testMinutes: Record<DemoProductCode, number> = { 'PM-150': 7, 'IM-4P': 4, 'DC-24A': 1.5 };

export function testDurationMs(productCode: DemoProductCode, prng: Prng): number {
  return Math.round(testMinutes[productCode] * minuteMs * prng.uniform(0.9, 1.15));
}

/** Rework before a retest takes between one and a half and four and a half hours. */
export function retestDelayMs(prng: Prng): number {
  return Math.round(prng.uniform(1.5, 4.5) * hourMs);
}

/** The stand software; PM-150's 4.3.0 came with limit revision 2. */
export function programVersion(productCode: DemoProductCode, at: Date, clock: DemoClock): string {
  if (productCode === 'IM-4P') return 'im4p-eol 2.7.1';
  if (productCode === 'DC-24A') return 'dc24a-eol 1.9.0';
  return at < clock.at(20) ? 'pm150-eol 4.2.0' : 'pm150-eol 4.3.0';
}
