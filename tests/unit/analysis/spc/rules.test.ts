import { describe, expect, it } from 'vitest';
import {
  allNelsonRules,
  allWesternElectricRules,
  describeRule,
  ruleViolations,
  ruleViolationsAt,
  ruleWindowLength,
  type RuleName,
} from '../../../../server/analysis/spc/index.js';

// Rule definitions: Nelson (1984), J. Quality Technology 16(4); Western Electric, Statistical
// Quality Control Handbook (1956). All sequences use centre 0 and σ = 1, so values read in σ.
const LIMITS = { center: 0, sigma: 1 };
const EVERY_RULE: RuleName[] = [...allNelsonRules, ...allWesternElectricRules];

function fired(points: number[]): { rule: RuleName; index: number }[] {
  return ruleViolations(points, LIMITS, EVERY_RULE).map(({ rule, index }) => ({ rule, index }));
}

describe('ruleViolations, one pattern per rule', () => {
  it('when one point is beyond 3σ, then nelson-1 and its twin we-1 fire there and nothing else', () => {
    expect(fired([0.5, -0.4, 3.2])).toEqual([
      { rule: 'nelson-1', index: 2 },
      { rule: 'we-1', index: 2 },
    ]);
  });

  it('when a point is exactly on 3σ, then it is not beyond (strict comparison)', () => {
    expect(fired([0.5, -0.4, 3])).toEqual([]);
  });

  it('when nine points sit on one side, then nelson-2 fires at the ninth (we-4 already at the eighth)', () => {
    // equal values so that neither trend nor alternation can form
    expect(fired(Array(9).fill(0.5))).toEqual([
      { rule: 'we-4', index: 7 },
      { rule: 'nelson-2', index: 8 },
      { rule: 'we-4', index: 8 },
    ]);
  });

  it('when eight points sit on one side, then only we-4 fires', () => {
    expect(fired(Array(8).fill(0.5))).toEqual([{ rule: 'we-4', index: 7 }]);
  });

  it('when a point lies exactly on the centre line, then it breaks the same-side run', () => {
    expect(fired([0.5, 0.5, 0.5, 0.5, 0, 0.5, 0.5, 0.5, 0.5, 0.5])).toEqual([]);
  });

  it('when six points rise steadily, then only nelson-3 fires, at the sixth', () => {
    const result = ruleViolations([-0.5, -0.3, -0.1, 0.1, 0.3, 0.5], LIMITS, EVERY_RULE);
    expect(result).toEqual([{ rule: 'nelson-3', index: 5, points: [0, 1, 2, 3, 4, 5] }]);
  });

  it('when six points fall steadily, then nelson-3 fires as well', () => {
    expect(fired([0.5, 0.3, 0.1, -0.1, -0.3, -0.5])).toEqual([{ rule: 'nelson-3', index: 5 }]);
  });

  it('when a trend contains two equal consecutive values, then the tie breaks it', () => {
    expect(fired([-0.5, -0.3, -0.3, -0.1, 0.1, 0.3, 0.5])).toEqual([]);
  });

  it('when fourteen points alternate up and down, then only nelson-4 fires, at the fourteenth', () => {
    const alternating = Array.from({ length: 14 }, (_, i) => (i % 2 === 0 ? 0.5 : -0.5));
    expect(fired(alternating)).toEqual([{ rule: 'nelson-4', index: 13 }]);
  });

  it('when an alternating run contains an equal step, then the tie breaks it', () => {
    // fifteen alternating points break nelson-4 twice; the ends at 1.2σ keep nelson-7 away
    const values: number[] = Array.from({ length: 15 }, (_, i) => (i % 2 === 0 ? 0.5 : -0.5));
    values[0] = 1.2;
    values[14] = 1.2;
    expect(fired(values)).toEqual([{ rule: 'nelson-4', index: 13 }, { rule: 'nelson-4', index: 14 }]);
    values.splice(7, 0, values[7]); // repeat one value mid-run: two runs of eight points
    expect(fired(values)).toEqual([]);
  });

  it('when two of three points are beyond 2σ on one side, then nelson-5 and we-2 fire at the second', () => {
    const result = ruleViolations([0.2, 2.5, -0.3, 2.4], LIMITS, ['nelson-5', 'we-2']);
    expect(result).toEqual([
      { rule: 'nelson-5', index: 3, points: [1, 3] },
      { rule: 'we-2', index: 3, points: [1, 3] },
    ]);
    expect(fired([0.2, 2.5, -0.3, 2.4])).toHaveLength(2);
  });

  it('when the two points beyond 2σ are on opposite sides or exactly on 2σ, then nothing fires', () => {
    expect(fired([2.5, -2.5, 0.3])).toEqual([]);
    expect(fired([2, 0.3, 2])).toEqual([]);
  });

  it('when four of five points are beyond 1σ on one side, then nelson-6 and we-3 fire at the fourth', () => {
    const result = ruleViolations([1.5, 1.2, 0.3, 1.8, 1.1], LIMITS, EVERY_RULE);
    expect(result).toEqual([
      { rule: 'nelson-6', index: 4, points: [0, 1, 3, 4] },
      { rule: 'we-3', index: 4, points: [0, 1, 3, 4] },
    ]);
  });

  it('when fifteen points stay within 1σ, then only nelson-7 fires, at the fifteenth', () => {
    // sides ++−−…, steps +−−++−−…: no run, trend or alternation longer than three points
    const hugging = [0.2, 0.5, -0.3, -0.6, 0.1, 0.4, -0.2, -0.5, 0.3, 0.6, -0.1, -0.4, 0.2, 0.5, -0.3];
    expect(fired(hugging)).toEqual([{ rule: 'nelson-7', index: 14 }]);
  });

  it('when eight points in a row are beyond 1σ on alternating sides, then only nelson-8 fires', () => {
    const mixture = [1.5, -1.5, 1.5, -1.5, 1.5, -1.5, 1.5, -1.5];
    expect(fired(mixture)).toEqual([{ rule: 'nelson-8', index: 7 }]);
  });

  it('when a random-looking in-control sequence is checked, then no rule fires', () => {
    // checked by hand: longest same-side run 3, longest monotone run 4 points, longest
    // alternation 7 points, points beyond 1σ never 2 of 5 on a side, never 15 inside 1σ
    const inControl = [
      0.3, -0.8, 1.2, 0.4, -1.5, -0.2, 0.9, 2.3, -0.6, 0.1, -1.1, -0.4, 0.7, 1.6, 0.2, -0.9, -2.1, 0.5, 1.0, -0.3, 0.6, -1.3,
      0.8, 0.05, -0.7, 1.4, -0.1, 0.35, -1.8, 0.45,
    ];
    expect(fired(inControl)).toEqual([]);
  });

  it('when a run continues past its length, then each further point is reported with the last points', () => {
    const result = ruleViolations(Array(10).fill(-0.5), LIMITS, ['nelson-2']);
    expect(result.map((v) => v.index)).toEqual([8, 9]);
    expect(result[1].points).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });

  it('when only some rules are selected, then only those are checked', () => {
    expect(fired([0, 3.5]).length).toBe(2);
    expect(ruleViolations([0, 3.5], LIMITS, ['we-4'])).toEqual([]);
    expect(ruleViolations([0, 3.5], LIMITS, [])).toEqual([]);
  });
});

describe('ruleViolationsAt', () => {
  /** Mulberry32, a small seeded PRNG, so the series is the same on every run. */
  function prng(seed: number): () => number {
    let a = seed >>> 0;
    return () => {
      a = (a + 0x6d2b79f5) >>> 0;
      let t = a;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
  }

  /** Noise with planted shifts, trends, alternation, stratification and mixtures. */
  function series(length: number): number[] {
    const random = prng(20240611);
    const gaussian = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
    const values: number[] = [];
    for (let i = 0; i < length; i++) {
      const phase = Math.floor(i / 100) % 6;
      const noise = gaussian();
      if (phase === 1) values.push(1.2 + noise * 0.8); // shift
      else if (phase === 2) values.push(((i % 100) - 50) * 0.05 + noise * 0.05); // trend
      else if (phase === 3) values.push((i % 2 === 0 ? 1 : -1) * (0.5 + Math.abs(noise) * 0.2)); // sawtooth
      else if (phase === 4) values.push(noise * 0.3); // stratification
      else if (phase === 5) values.push((i % 2 === 0 ? 1.6 : -1.6) + noise * 0.2); // mixture
      else values.push(noise);
    }
    return values;
  }

  it('when fed a trailing window point by point, then it agrees with the batch form everywhere', () => {
    const values = series(3000);
    const batch = ruleViolations(values, LIMITS, EVERY_RULE);
    // a meaningful comparison: every rule occurs somewhere in the series
    expect(new Set(batch.map((v) => v.rule))).toEqual(new Set(EVERY_RULE));

    const incremental = [];
    for (let i = 0; i < values.length; i++) {
      const start = Math.max(0, i - ruleWindowLength + 1);
      for (const v of ruleViolationsAt(values.slice(start, i + 1), LIMITS, EVERY_RULE)) {
        incremental.push({ rule: v.rule, index: v.index + start, points: v.points.map((p) => p + start) });
      }
    }
    expect(incremental).toEqual(batch);
  });

  it('when asked for the window length, then it is Nelson 7’s fifteen points', () => {
    expect(ruleWindowLength).toBe(15);
  });
});

describe('rule catalogue and arguments', () => {
  it('when the rule lists are read, then they hold Nelson 1–8 and WE 1–4 in order', () => {
    expect(allNelsonRules).toEqual(['nelson-1', 'nelson-2', 'nelson-3', 'nelson-4', 'nelson-5', 'nelson-6', 'nelson-7', 'nelson-8']);
    expect(allWesternElectricRules).toEqual(['we-1', 'we-2', 'we-3', 'we-4']);
  });

  it('when a rule is described, then the text names its count and zone', () => {
    expect(describeRule('nelson-4')).toMatch(/Fourteen points in a row alternating/);
    expect(describeRule('we-2')).toMatch(/Two out of three .* 2 sigma .* same side/);
    expect(() => describeRule('nelson-9' as RuleName)).toThrow(/rule must be one of/);
  });

  it('when arguments are bad, then the error names the argument', () => {
    expect(() => ruleViolations([1, 2], { center: 0, sigma: 0 }, ['we-1'])).toThrow(/limits.sigma must be greater than 0/);
    expect(() => ruleViolations([1, Number.NaN], LIMITS, ['we-1'])).toThrow(/points\[1\] must be a finite number/);
    expect(() => ruleViolations([1, 2], LIMITS, ['we-9' as RuleName])).toThrow(/rules\[0\] is not a known rule/);
    expect(() => ruleViolationsAt([1, 2], { center: Number.NaN, sigma: 1 }, ['we-1'])).toThrow(/limits.center/);
  });
});
