import type { RulePattern } from './ruleCatalog.js';

/**
 * One pass over the points per pattern, O(n) time and O(1) state, so the whole Nelson set on
 * 100 000 points stays far below the ingest budget. `emit` receives the index at which the
 * pattern is completed and the indices of the points that make it up (for runs, the last
 * `length` points; for m-of-n, the points beyond the limit inside the n-point window).
 * The tie conventions are those stated in ruleCatalog.ts.
 */

export type Emit = (index: number, points: number[]) => void;

function consecutive(first: number, last: number): number[] {
  const indices = new Array<number>(last - first + 1);
  for (let i = first; i <= last; i++) indices[i - first] = i;
  return indices;
}

/** Drives a run counter: `step` returns the run length (in points) ending at i. */
function scanRuns(count: number, length: number, step: (i: number, run: number) => number, emit: Emit): void {
  let run = 0;
  for (let i = 0; i < count; i++) {
    run = step(i, run);
    if (run >= length) emit(i, consecutive(i - length + 1, i));
  }
}

/** Sign of the step into point i: +1 up, −1 down, 0 for an equal value or the first point. */
function direction(values: readonly number[], i: number): number {
  return i === 0 ? 0 : Math.sign(values[i] - values[i - 1]);
}

/** Finds every completion of one pattern in one pass over the points. */
export function detectPattern(
  pattern: RulePattern,
  values: readonly number[],
  center: number,
  sigma: number,
  emit: Emit,
): void {
  const count = values.length;
  switch (pattern.kind) {
    case 'beyond': {
      const limit = pattern.sigmas * sigma;
      for (let i = 0; i < count; i++) if (Math.abs(values[i] - center) > limit) emit(i, [i]);
      return;
    }
    case 'sameSide':
      scanRuns(
        count,
        pattern.length,
        (i, run) => {
          const side = Math.sign(values[i] - center);
          if (side === 0) return 0;
          return i > 0 && Math.sign(values[i - 1] - center) === side ? run + 1 : 1;
        },
        emit,
      );
      return;
    case 'trend':
    case 'alternating': {
      // A run of k points holds k − 1 steps; an equal value (step 0) restarts the run at 1.
      const wantedPrevious = pattern.kind === 'trend' ? 1 : -1;
      scanRuns(
        count,
        pattern.length,
        (i, run) => {
          const step = direction(values, i);
          if (step === 0) return 1;
          return direction(values, i - 1) * step === wantedPrevious ? run + 1 : 2;
        },
        emit,
      );
      return;
    }
    case 'within':
    case 'outside': {
      const limit = pattern.sigmas * sigma;
      const inside = pattern.kind === 'within';
      scanRuns(count, pattern.length, (i, run) => ((Math.abs(values[i] - center) <= limit) === inside ? run + 1 : 0), emit);
      return;
    }
    case 'mOfN':
      detectMOfN(pattern.m, pattern.n, pattern.sigmas * sigma, values, center, emit);
      return;
  }
}

/**
 * m of the last n points beyond the limit on one side. The completing point must itself be one
 * of them, so a pattern is reported once, where it is completed. Near the start a shorter
 * window counts: two of the first two points beyond 2σ already break "2 of 3".
 */
function detectMOfN(m: number, n: number, limit: number, values: readonly number[], center: number, emit: Emit): void {
  const sideBeyond = (i: number): number => {
    const deviation = values[i] - center;
    return deviation > limit ? 1 : deviation < -limit ? -1 : 0;
  };
  let above = 0;
  let below = 0;
  for (let i = 0; i < values.length; i++) {
    const side = sideBeyond(i);
    if (side === 1) above++;
    if (side === -1) below++;
    if (i >= n) {
      const leaving = sideBeyond(i - n);
      if (leaving === 1) above--;
      if (leaving === -1) below--;
    }
    if (side !== 0 && (side === 1 ? above : below) >= m) {
      const points: number[] = [];
      for (let j = Math.max(0, i - n + 1); j <= i; j++) if (sideBeyond(j) === side) points.push(j);
      emit(i, points);
    }
  }
}
