import type { DemoClock } from './clock.js';
import { everydayFaults, type FaultKind } from './faults.js';
import { demoLots, driftingLot, lotNumberOf, type DemoLot } from './lots.js';
import { calibrationHoldLotCode, calibrationHoldMotors, minimumLotMotors, scriptedAttempts } from './notable.js';
import { forkPrng, type Prng } from './prng.js';
import { operatorBadge, programVersion, retestDelayMs, stationFor, testDurationMs } from './schedule.js';
import { overdueStationCode } from './stations.js';
import { drawLotProcess, type MotorContext } from './values/shared.js';

export type PlannedAttempt = {
  startedAt: Date; finishedAt: Date; stationCode: string; operatorBadge: string; programVersion: string;
  faults: readonly FaultKind[];
};

/** A motor and the runs it may get; a run that passes ends the list. */
export type PlannedMotor = { serial: string; lot: DemoLot; context: MotorContext; attempts: PlannedAttempt[] };

/** Share of motors with an everyday fault on their first test. */
const faultRate = 0.035;
const serialPrefix = { 'PM-150': 'PM150', 'IM-4P': 'IM4P', 'DC-24A': 'DC24A' } as const;
const motorsPerDay = { 'PM-150': 1, 'IM-4P': 1.3, 'DC-24A': 2 } as const;

/**
 * Lot sizes for a demo of `totalMotors` motors: fixed story lots, the rest shared by production
 * time (largest remainders, so the sizes add up), never below the smallest lot the story needs.
 */
export function lotSizes(totalMotors: number): Map<string, number> {
  const fixed = demoLots.reduce((sum, lot) => sum + (lot.fixedMotors ?? 0), 0);
  const shared = demoLots.filter((lot) => !lot.fixedMotors);
  const weight = (lot: DemoLot) => (lot.startDaysAgo - lot.endDaysAgo) * motorsPerDay[lot.productCode];
  const totalWeight = shared.reduce((sum, lot) => sum + weight(lot), 0);
  const exact = shared.map((lot) => ({ lot, share: (Math.max(0, totalMotors - fixed) * weight(lot)) / totalWeight }));
  const leftOver = Math.max(0, totalMotors - fixed) - exact.reduce((sum, e) => sum + Math.floor(e.share), 0);
  const roundedUp = new Set([...exact].sort((a, b) => (b.share % 1) - (a.share % 1)).slice(0, leftOver).map((e) => e.lot.code));
  const sizes = new Map(exact.map((e) => [e.lot.code, Math.max(minimumLotMotors, Math.floor(e.share) + (roundedUp.has(e.lot.code) ? 1 : 0))]));
  return new Map(demoLots.map((lot) => [lot.code, lot.fixedMotors ?? (sizes.get(lot.code) as number)]));
}

/** Every motor of the demo with its planned runs, deterministic for a seed, size and day. */
export function planMotors(seed: number, clock: DemoClock, totalMotors: number): PlannedMotor[] {
  const sizes = lotSizes(totalMotors);
  return demoLots.flatMap((lot) => {
    const count = sizes.get(lot.code) as number;
    const process = drawLotProcess(forkPrng(seed, lot.code));
    const lotProcess = lot === driftingLot ? { ...process, keShiftPct: 0 } : process;
    const held = lot.code === calibrationHoldLotCode ? spreadIndices(count, calibrationHoldMotors) : new Set<number>();
    return Array.from({ length: count }, (_, index) => {
      const serial = `${serialPrefix[lot.productCode]}-${String(lotNumberOf(lot) * 10000 + index + 1).padStart(6, '0')}`;
      const prng = forkPrng(seed, serial);
      // The drifting lot's Ke climbs 0.6 % per 20 motors from 0.6 % below nominal.
      const keDriftPct = lot === driftingLot ? -0.6 + (0.6 * index) / 20 : 0;
      const span = lot.startDaysAgo - lot.endDaysAgo;
      const firstAt = clock.at(lot.startDaysAgo - (span * (index + prng.uniform(0.1, 0.9))) / count);
      const faults = held.has(index) ? [[]] : scriptedAttempts.get(serial) ?? everydayAttempts(lot, prng);
      const attempts = planAttempts(lot, faults, firstAt, held.has(index), clock, prng);
      return { serial, lot, context: { prng, lot: lotProcess, keDriftPct }, attempts };
    });
  });
}

/** `n` indices spread evenly over a lot of `size`, starting with the first motor. */
function spreadIndices(size: number, n: number): Set<number> {
  return new Set(Array.from({ length: n }, (_, k) => Math.floor((k * size) / n)));
}

/**
 * Most motors are clean (a retest is planned in case a value falls outside by chance). A faulty
 * one is reworked and retested; most reworks cure it, a few do not, and a few await rework.
 */
function everydayAttempts(lot: DemoLot, prng: Prng): FaultKind[][] {
  if (!prng.chance(faultRate)) return [[], []];
  const fault = prng.pick(everydayFaults[lot.productCode]);
  const outcome = prng.next();
  if (outcome < 0.82) return [[fault], []];
  return outcome < 0.92 ? [[fault], [fault]] : [[fault]];
}

function planAttempts(lot: DemoLot, faults: ReadonlyArray<readonly FaultKind[]>, firstAt: Date, onOverdueStation: boolean, clock: DemoClock, prng: Prng): PlannedAttempt[] {
  const attempts: PlannedAttempt[] = [];
  let startedAt = firstAt;
  for (const attemptFaults of faults) {
    const finishedAt = new Date(startedAt.getTime() + testDurationMs(lot.productCode, prng));
    attempts.push({
      startedAt, finishedAt, faults: attemptFaults,
      stationCode: onOverdueStation ? overdueStationCode : stationFor(lot.line, startedAt, clock, prng),
      operatorBadge: operatorBadge(lot.line, startedAt), programVersion: programVersion(lot.productCode, startedAt, clock),
    });
    startedAt = new Date(finishedAt.getTime() + retestDelayMs(prng));
  }
  return attempts;
}
