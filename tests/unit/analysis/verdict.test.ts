import { describe, expect, it } from 'vitest';
import { judge, positionInLimits } from '../../../server/analysis/verdict.js';

// All checks here follow the inclusive-limit convention (common practice): LSL ≤ value ≤ USL passes.

describe('judge', () => {
  it('when a value lies inside two-sided limits, then it passes; outside either side, it fails', () => {
    const limits = { lsl: 0.095, usl: 0.105 };
    expect(judge(0.1, limits)).toBe('pass');
    expect(judge(0.0949, limits)).toBe('fail');
    expect(judge(0.1051, limits)).toBe('fail');
  });

  it('when a value is exactly on a limit, then it passes', () => {
    expect(judge(0.095, { lsl: 0.095, usl: 0.105 })).toBe('pass');
    expect(judge(0.105, { lsl: 0.095, usl: 0.105 })).toBe('pass');
  });

  it('when only a lower limit is set, then any value at or above it passes', () => {
    // e.g. IEEE Std 43-2013 minimum IR of 100 MΩ is a lower limit only
    expect(judge(1e6, { lsl: 100, usl: null })).toBe('pass');
    expect(judge(99.9, { lsl: 100, usl: null })).toBe('fail');
  });

  it('when only an upper limit is set, then any value at or below it passes', () => {
    expect(judge(-5, { lsl: null, usl: 2 })).toBe('pass');
    expect(judge(2.01, { lsl: null, usl: 2 })).toBe('fail');
  });

  it('when no limit is set, then a finite value passes', () => {
    expect(judge(42, { lsl: null, usl: null })).toBe('pass');
  });

  it('when the value is NaN or infinite, then it fails even with no limits', () => {
    expect(judge(Number.NaN, { lsl: null, usl: null })).toBe('fail');
    expect(judge(Number.NaN, { lsl: 0, usl: 1 })).toBe('fail');
    expect(judge(Number.POSITIVE_INFINITY, { lsl: 0, usl: null })).toBe('fail');
  });

  it('when the limits are crossed or not finite, then it throws naming them', () => {
    expect(() => judge(1, { lsl: 2, usl: 1 })).toThrow(/limits\.lsl.*above.*limits\.usl/);
    expect(() => judge(1, { lsl: Number.NaN, usl: 1 })).toThrow(/limits\.lsl/);
  });
});

describe('positionInLimits', () => {
  it('when a value is a quarter of the way from LSL to USL, then it is 0.25', () => {
    expect(positionInLimits(0.0975, { lsl: 0.095, usl: 0.105 })).toBeCloseTo(0.25, 10);
  });

  it('when a value is outside the limits, then it pins to 0 or 1', () => {
    expect(positionInLimits(-3, { lsl: 0, usl: 10 })).toBe(0);
    expect(positionInLimits(13, { lsl: 0, usl: 10 })).toBe(1);
  });

  it('when the limits are one-sided, coincide, or the value is NaN, then it is null', () => {
    expect(positionInLimits(5, { lsl: 0, usl: null })).toBeNull();
    expect(positionInLimits(5, { lsl: null, usl: 10 })).toBeNull();
    expect(positionInLimits(5, { lsl: 5, usl: 5 })).toBeNull();
    expect(positionInLimits(Number.NaN, { lsl: 0, usl: 10 })).toBeNull();
  });
});
