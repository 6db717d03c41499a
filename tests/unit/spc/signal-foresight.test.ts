import { describe, expect, it } from 'vitest';
import { signalWouldOpen, type IngestedRun, type SpcStateRow } from '../../../server/services/spc/evaluate-after-ingest.js';
import { freshState, type SpcStateData } from '../../../server/services/spc/phase-two-step.js';

// The ingest writer asks signalWouldOpen, with the SPC states read at the start of a batch,
// whether judging the batch opens a signal; a rule is broken by the usual Nelson patterns
// (Nelson, J. Quality Technology 16(4), 1984: rule 1, a point beyond 3 sigma).
const characteristicId = 7;
const limits = { limitId: 1, kind: 'individuals' as const, centre: 50, sigma: 0.1, subgroupSize: null, rules: ['nelson-1' as const], params: {} };

function rowWith(state: SpcStateData): SpcStateRow {
  return { characteristic_id: characteristicId, control_limit_id: 1, state_json: JSON.stringify(state) };
}

function runs(values: number[]): IngestedRun[] {
  return values.map((value, i) => ({
    runId: 100 + i, motorId: i, lotId: 3, productId: 1, startedAt: new Date(0), receivedAt: new Date(0),
    measurements: [{ characteristicId, value }, { characteristicId: characteristicId + 1, value: 1e9 }],
  }));
}

describe('foreseeing whether an ingest batch opens a signal', () => {
  it('when every value is within the control limits, then no signal would open', () => {
    expect(signalWouldOpen(runs([50, 50.1, 49.9, 50.2]), [rowWith(freshState(limits))])).toBe(false);
  });

  it('when one value lies beyond 3 sigma, then a signal would open', () => {
    expect(signalWouldOpen(runs([50, 50.1, 50.31, 50]), [rowWith(freshState(limits))])).toBe(true);
  });

  it('when the rule is broken while its episode goes on, then no new signal would open', () => {
    const ongoing = { ...freshState(limits), episodes: { 'nelson-1': 42 } };
    expect(signalWouldOpen(runs([50.4, 50.5]), [rowWith(ongoing)])).toBe(false);
  });

  it('when an episode ends with a value in control and the rule is broken again, then a new signal would open', () => {
    const ongoing = { ...freshState(limits), episodes: { 'nelson-1': 42 } };
    expect(signalWouldOpen(runs([50.4, 50, 50.4]), [rowWith(ongoing)])).toBe(true);
  });

  it('when a characteristic has no SPC state row, then its values open nothing', () => {
    expect(signalWouldOpen(runs([1e9]), [])).toBe(false);
  });

  it('when it is asked, then the state it was given is left as it was', () => {
    const row = { ...rowWith(freshState(limits)), state_json: freshState(limits) };
    signalWouldOpen(runs([50, 50.4]), [row]);
    expect(row.state_json).toEqual(freshState(limits));
  });
});
