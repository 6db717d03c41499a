import { describe, expect, it } from 'vitest';
import { toResultsPage, VerdictCodes } from '../../server/services/evidence/results-page.js';
import type { MeasurementRow, PackRun } from '../../server/services/evidence/read-pack-runs.js';

const run = (id: number, measurements: MeasurementRow[]): PackRun => ({
  id, uuid: `run-${id}`, serial: `SN-${id}`, attempt: 1, startedAt: new Date(Date.UTC(2026, 0, id)), station: 'EOL-1',
  calibrationDue: new Date(Date.UTC(2026, 6, 1)), operatorBadge: 'B-7', programVersion: 'p1', limitRevision: 2, verdict: 'pass', measurements,
});

// Characteristic ids 11, 12, 13 stand in columns 0, 1, 2 of the product's Results sheet.
const column = new Map([[11, 0], [12, 1], [13, 2]]);

describe('Results page', () => {
  it('when runs measured their characteristics, then each value and verdict stands in its column, run by run', () => {
    const page = toResultsPage([
      run(1, [[1, 11, 1.5, 1, 2, 'pass'], [1, 12, -0.25, null, 0, 'fail'], [1, 13, 42, 40, 44, 'pass']]),
      run(2, [[2, 13, 7e-9, null, null, 'pass'], [2, 11, 3, 1, 2, 'fail']]),
    ], column, new VerdictCodes());
    expect(page.runs.map((r) => r.serial)).toEqual(['SN-1', 'SN-2']);
    expect(page.runs[0]).not.toHaveProperty('measurements');
    expect(page.measurements).toBe(5);
    expect(Array.from(page.values)).toEqual([1.5, -0.25, 42, 3, 0, 7e-9]);
    expect(Array.from(page.verdicts, (code) => page.verdictNames[code])).toEqual(['pass', 'fail', 'pass', 'fail', '', 'pass']);
  });

  it('when a run did not measure a characteristic, then its cell is marked not measured (code 0), not a measured 0', () => {
    const page = toResultsPage([run(1, [[1, 12, 0, 0, 1, 'pass']])], column, new VerdictCodes());
    expect(Array.from(page.verdicts)).toEqual([0, page.verdictNames.indexOf('pass'), 0]);
    expect(page.values[1]).toBe(0);
  });

  it('when a run holds a characteristic outside the product plan, then it has no column and is left out', () => {
    const page = toResultsPage([run(1, [[1, 99, 5, 0, 10, 'fail'], [1, 11, 1, 0, 2, 'pass']])], column, new VerdictCodes());
    expect(page.measurements).toBe(2);
    expect(Array.from(page.verdicts, (code) => page.verdictNames[code])).toEqual(['pass', '', '']);
  });

  it('when pages follow one another, then a verdict keeps its code for the whole pack', () => {
    const codes = new VerdictCodes();
    const first = toResultsPage([run(1, [[1, 11, 1, 0, 2, 'fail']])], column, codes);
    const second = toResultsPage([run(2, [[2, 11, 1, 0, 2, 'pass'], [2, 12, 9, 0, 2, 'fail']])], column, codes);
    expect(second.verdicts[1]).toBe(first.verdicts[0]);
    expect(second.verdictNames[second.verdicts[0]]).toBe('pass');
  });
});
