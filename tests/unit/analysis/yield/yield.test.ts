import { describe, expect, it } from 'vitest';
import {
  dpmo,
  finalYield,
  firstPassYield,
  rolledThroughputYield,
  summarizeAttempts,
} from '../../../../server/analysis/yield/index.js';
import type { Verdict } from '../../../../server/analysis/yield/index.js';

describe('firstPassYield, finalYield, summarizeAttempts', () => {
  it('when 7 motors pass first, 2 fail then pass and 1 fails twice, then FPY is 0.7 and final yield 0.9', () => {
    // common practice: FPY = first-time passes / tested; final yield = eventual passes / tested
    const units: Verdict[][] = [
      ...Array.from({ length: 7 }, (): Verdict[] => ['pass']),
      ['fail', 'pass'],
      ['fail', 'pass'],
      ['fail', 'fail'],
    ];
    const counts = summarizeAttempts(units);
    expect(counts).toEqual({ tested: 10, passedFirst: 7, passedFinal: 9 });
    expect(firstPassYield(counts)).toBeCloseTo(0.7, 12);
    expect(finalYield(counts)).toBeCloseTo(0.9, 12);
  });

  it('when a unit passes and then fails a retest, then it is a first pass but not a final pass', () => {
    // common practice: the latest verdict stands
    expect(summarizeAttempts([['pass', 'fail']])).toEqual({ tested: 1, passedFirst: 1, passedFinal: 0 });
  });

  it('when nothing was tested, then both yields are null', () => {
    expect(firstPassYield({ tested: 0, passedFirst: 0 })).toBeNull();
    expect(finalYield({ tested: 0, passedFinal: 0 })).toBeNull();
    expect(summarizeAttempts([])).toEqual({ tested: 0, passedFirst: 0, passedFinal: 0 });
  });

  it('when the counts are impossible, then it throws naming the argument', () => {
    expect(() => firstPassYield({ tested: 5, passedFirst: 6 })).toThrow(/passedFirst.*exceed/);
    expect(() => finalYield({ tested: -1, passedFinal: 0 })).toThrow(/tested/);
    expect(() => firstPassYield({ tested: 4.5, passedFirst: 1 })).toThrow(/tested.*whole/);
  });

  it('when a unit has no attempts or an unknown verdict, then it throws naming its index', () => {
    expect(() => summarizeAttempts([['pass'], []])).toThrow(/verdictsInAttemptOrder\[1\]/);
    expect(() => summarizeAttempts([['pass', 'maybe' as Verdict]])).toThrow(/verdictsInAttemptOrder\[0\]\[1\]/);
  });
});

describe('rolledThroughputYield', () => {
  it('when two stations yield 0.97 and 0.94, then RTY is 0.9118', () => {
    // iSixSigma forum "Rolled throughput yield for a process": 0.97 × 0.94 = 0.91
    expect(rolledThroughputYield([0.97, 0.94])).toBeCloseTo(0.9118, 10);
  });

  it('when three steps yield 0.95, 0.84 and 0.88, then RTY is about 0.70', () => {
    // Minitab help, "What are throughput yield and rolled throughput yield": label process → 0.70
    expect(rolledThroughputYield([0.95, 0.84, 0.88])).toBeCloseTo(0.70224, 10);
  });

  it('when the list is empty or a yield is outside 0…1, then it throws naming the argument', () => {
    expect(() => rolledThroughputYield([])).toThrow(/stationYields/);
    expect(() => rolledThroughputYield([0.9, 1.2])).toThrow(/stationYields\[1\]/);
    expect(() => rolledThroughputYield([Number.NaN])).toThrow(/stationYields\[0\]/);
  });
});

describe('dpmo', () => {
  it('when 400 units with 6 opportunities show 60 defects, then DPMO is 25 000', () => {
    // common practice: 10⁶ × 60 / (400 × 6)
    expect(dpmo({ defects: 60, units: 400, opportunitiesPerUnit: 6 })).toBeCloseTo(25_000, 9);
  });

  it('when 1000 widgets with 10 characteristics show 50 errors, then DPMO is 5000', () => {
    // mysixsigmatrainer.com Six Sigma glossary, "Defects per million opportunities" worked example
    expect(dpmo({ defects: 50, units: 1000, opportunitiesPerUnit: 10 })).toBeCloseTo(5000, 9);
  });

  it('when 40 000 shifters with 6 opportunities show 40 defects, then DPMO is about 167', () => {
    // dmaictools.com "DPMO calculation – product example" (shifter assembly): 167 DPMO
    expect(dpmo({ defects: 40, units: 40_000, opportunitiesPerUnit: 6 })).toBeCloseTo(166.667, 3);
  });

  it('when the counts are not whole, not positive or exceed the opportunities, then it throws naming the argument', () => {
    expect(() => dpmo({ defects: 1, units: 0, opportunitiesPerUnit: 6 })).toThrow(/units/);
    expect(() => dpmo({ defects: 1, units: 10, opportunitiesPerUnit: 1.5 })).toThrow(/opportunitiesPerUnit/);
    expect(() => dpmo({ defects: -1, units: 10, opportunitiesPerUnit: 6 })).toThrow(/defects/);
    expect(() => dpmo({ defects: 61, units: 10, opportunitiesPerUnit: 6 })).toThrow(/defects.*exceed/);
  });
});
