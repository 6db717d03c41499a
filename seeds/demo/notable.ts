import type { FaultKind } from './faults.js';

/**
 * Serials and lots the README and the browser tests can name. They exist at every demo size
 * (their lots always hold at least `minimumLotMotors` motors) and are the same on every run.
 */
export const demoSerials = {
  /** Passed its first test, nothing open. */
  passing: 'PM150-090001',
  /** Failed resistance unbalance (poor crimp), re-crimped, passed on attempt 2. */
  failingThenPassed: 'PM150-090002',
  /** Tested on EOL-B2 after its calibration fell due: on calibration hold. */
  onCalibrationHold: 'PM150-130001',
  /** One back-EMF line voltage low: back-EMF unbalance fails, and fails again on retest. */
  damagedMagnet: 'PM150-110004',
  /** Phase leads exchanged: phase sequence and spacing fail; reconnected, passed on attempt 2. */
  swappedSequence: 'PM150-110007',
} as const;

/** All motors with the damaged-magnet signature (failed twice, status failed). */
export const damagedMagnetSerials = ['PM150-090005', demoSerials.damagedMagnet, 'PM150-110009'] as const;

/** The lot whose back-EMF constant drifts upward towards the USL (the SPC story). */
export const driftingLotCode = 'L2611-12';

/** The PM lot partly tested on the overdue station EOL-B2. */
export const calibrationHoldLotCode = 'L2611-13';

/** How many of that lot's motors were tested on EOL-B2 (each is then on calibration hold). */
export const calibrationHoldMotors = 12;

/** Smallest lot at any demo size, so every notable serial above exists. */
export const minimumLotMotors = calibrationHoldMotors;

/** The faults of each scripted motor, one set per attempt. */
export const scriptedAttempts: ReadonlyMap<string, ReadonlyArray<readonly FaultKind[]>> = new Map([
  [demoSerials.passing, [[]]],
  [demoSerials.failingThenPassed, [['crimp'], []]],
  [demoSerials.swappedSequence, [['swapped-sequence'], []]],
  ...damagedMagnetSerials.map((serial): [string, FaultKind[][]] => [serial, [['damaged-magnet'], ['damaged-magnet']]]),
]);
