import { isActiveHold, type Hold, type MotorRecord, type TestRun } from '../../api/motor-schemas';

export type Decision = 'may ship' | 'must not ship' | 'on hold' | 'not tested';

export type ReleaseDecision = {
  decision: Decision;
  activeHolds: Hold[];
  latestRun?: TestRun;
  /** What the person holding the motor does now, in plain words. */
  nextStep: string;
};

/**
 * Any active hold wins: nobody ships or reworks a held motor until quality releases it.
 * Then a failed latest run, then no run at all; only a passed run with no hold may ship.
 */
export function decideRelease(record: MotorRecord): ReleaseDecision {
  const activeHolds = record.holds.filter(isActiveHold);
  const latestRun = record.runs[0];
  const failed = latestRun?.verdict === 'fail' || record.status === 'failed';

  if (activeHolds.length > 0 || record.status === 'on hold') {
    return {
      decision: 'on hold',
      activeHolds,
      latestRun,
      nextStep: failed
        ? 'Put it in the hold area and wait for quality release. It also failed its test: after release, send it to rework.'
        : 'Put it in the hold area and wait for quality release.',
    };
  }
  if (failed) {
    return { decision: 'must not ship', activeHolds, latestRun, nextStep: 'Send to rework, then send it to retest.' };
  }
  if (!latestRun || record.status === 'not tested') {
    return { decision: 'not tested', activeHolds, latestRun, nextStep: 'Send it to the end-of-line test station.' };
  }
  return { decision: 'may ship', activeHolds, latestRun, nextStep: 'Pack it for shipping.' };
}
