/**
 * Yield from counts of tested units, with the definitions used across quality engineering
 * (common practice; e.g. Minitab's help on throughput yield).
 * A period with no tested units has no yield, so the result is null rather than 0 or 1.
 */

export type Verdict = 'pass' | 'fail';

function requireCount(name: string, value: number): number {
  if (!Number.isInteger(value) || value < 0) {
    throw new Error(`${name} must be a whole number of units, zero or more, got ${String(value)}`);
  }
  return value;
}

function yieldFraction(passedName: string, passed: number, tested: number): number | null {
  requireCount('tested', tested);
  requireCount(passedName, passed);
  if (passed > tested) {
    throw new Error(`${passedName} must not exceed tested (${tested}), got ${passed}`);
  }
  return tested === 0 ? null : passed / tested;
}

/**
 * First-pass yield FPY = units passing their first test, without retest or rework ÷ units tested
 * (common practice). Null when nothing was tested.
 */
export function firstPassYield(input: { tested: number; passedFirst: number }): number | null {
  return yieldFraction('passedFirst', input.passedFirst, input.tested);
}

/**
 * Final yield = units whose last test passed (after any retest or rework) ÷ units tested
 * (common practice). Null when nothing was tested.
 */
export function finalYield(input: { tested: number; passedFinal: number }): number | null {
  return yieldFraction('passedFinal', input.passedFinal, input.tested);
}

/**
 * Counts for {@link firstPassYield} and {@link finalYield} from each unit's verdicts in attempt
 * order. A unit counts as passed first when its first attempt passed, and passed final when its
 * latest attempt passed, so a unit that passed and then failed a later retest is not a final pass.
 */
export function summarizeAttempts(verdictsInAttemptOrder: Verdict[][]): {
  tested: number;
  passedFirst: number;
  passedFinal: number;
} {
  if (!Array.isArray(verdictsInAttemptOrder)) {
    throw new Error('verdictsInAttemptOrder must be an array with one verdict list per unit');
  }
  let passedFirst = 0;
  let passedFinal = 0;
  verdictsInAttemptOrder.forEach((attempts, i) => {
    if (!Array.isArray(attempts) || attempts.length === 0) {
      throw new Error(`verdictsInAttemptOrder[${i}] must hold at least one verdict: an untested unit has no yield`);
    }
    attempts.forEach((verdict, j) => {
      if (verdict !== 'pass' && verdict !== 'fail') {
        throw new Error(`verdictsInAttemptOrder[${i}][${j}] must be 'pass' or 'fail', got ${String(verdict)}`);
      }
    });
    if (attempts[0] === 'pass') passedFirst += 1;
    if (attempts[attempts.length - 1] === 'pass') passedFinal += 1;
  });
  return { tested: verdictsInAttemptOrder.length, passedFirst, passedFinal };
}
