import { describe, expect, it } from 'vitest';
import type { Hold, MotorRecord, TestRun } from '../../../src/features/motors/api/motor-schemas';
import { decideRelease } from '../../../src/features/motors/components/scan/release-decision';

const run = (verdict: 'pass' | 'fail'): TestRun => ({
  runId: 'r1', attempt: 1, verdict, startedAt: '2026-12-01T08:00:00Z', finishedAt: '2026-12-01T08:02:00Z',
  station: { code: 'EOL-A1', line: 'A' }, operatorBadge: 'B-1', programVersion: '1.0', limitRevision: 1,
  calibrationOk: true, calibrationDue: '2027-01-01', results: [], waveforms: [], readings: [],
});

const hold = (releasedAt: string | null): Hold => ({
  id: 1, target: { type: 'lot', code: 'L1' }, kind: 'manual', reason: 'drift', placedBy: 'q', placedAt: '2026-12-01T09:00:00Z',
  releasedBy: releasedAt ? 'q' : null, releasedAt, releaseReason: null,
});

const record = (overrides: Partial<MotorRecord>): MotorRecord => ({
  serial: 'S1', product: { code: 'P', name: 'P', motorKind: 'pmsm' }, lot: { code: 'L1', components: [] },
  status: 'passed', holds: [], reworkNotes: [], runs: [run('pass')], auditEvents: [], ...overrides,
});

describe('decideRelease', () => {
  it('when the latest run passed and nothing is held, then the motor may ship', () => {
    expect(decideRelease(record({})).decision).toBe('may ship');
  });
  it('when the latest run failed, then it must not ship and goes to rework', () => {
    const release = decideRelease(record({ status: 'failed', runs: [run('fail')] }));
    expect(release.decision).toBe('must not ship');
    expect(release.nextStep).toMatch(/rework/);
  });
  it('when an active hold exists on a passed motor, then it is on hold with that hold listed', () => {
    const release = decideRelease(record({ status: 'on hold', holds: [hold(null)] }));
    expect(release.decision).toBe('on hold');
    expect(release.activeHolds).toHaveLength(1);
  });
  it('when a failed motor is also held, then the hold wins and the step mentions rework after release', () => {
    const release = decideRelease(record({ status: 'on hold', holds: [hold(null)], runs: [run('fail')] }));
    expect(release.decision).toBe('on hold');
    expect(release.nextStep).toMatch(/rework/);
  });
  it('when the only hold was released, then it no longer blocks shipping', () => {
    expect(decideRelease(record({ holds: [hold('2026-12-01T10:00:00Z')] })).decision).toBe('may ship');
  });
  it('when there is no run, then the motor is not tested', () => {
    expect(decideRelease(record({ status: 'not tested', runs: [] })).decision).toBe('not tested');
  });
  it('when the server says passed but the latest run failed, then it still must not ship', () => {
    expect(decideRelease(record({ status: 'passed', runs: [run('fail')] })).decision).toBe('must not ship');
  });
});
