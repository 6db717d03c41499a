/**
 * The run rules Fluxtrail can apply, what each one looks for, and its plain-English text.
 * Nelson, L. S. (1984), "The Shewhart Control Chart — Tests for Special Causes", Journal of
 * Quality Technology 16(4); Western Electric, Statistical Quality Control Handbook (1956).
 *
 * Tie conventions (Fluxtrail's decisions, stated here and in describeRule):
 * - "beyond kσ" is strictly beyond: a point exactly on center ± kσ is not beyond;
 *   "within 1σ" (Nelson 7) is its complement, |x − center| ≤ σ.
 * - a point exactly on the centre line is on neither side and breaks a same-side run;
 * - for trend (Nelson 3) and alternation (Nelson 4) two equal consecutive values break the run.
 */

export type RuleName =
  | 'nelson-1'
  | 'nelson-2'
  | 'nelson-3'
  | 'nelson-4'
  | 'nelson-5'
  | 'nelson-6'
  | 'nelson-7'
  | 'nelson-8'
  | 'we-1'
  | 'we-2'
  | 'we-3'
  | 'we-4';

/** The pattern each rule looks for; lengths count points, not differences. */
export type RulePattern =
  | { kind: 'beyond'; sigmas: number }
  | { kind: 'sameSide'; length: number }
  | { kind: 'trend'; length: number }
  | { kind: 'alternating'; length: number }
  | { kind: 'mOfN'; m: number; n: number; sigmas: number }
  | { kind: 'within'; length: number; sigmas: number }
  | { kind: 'outside'; length: number; sigmas: number };

interface RuleEntry {
  pattern: RulePattern;
  description: string;
}

const CATALOG: Record<RuleName, RuleEntry> = {
  'nelson-1': {
    pattern: { kind: 'beyond', sigmas: 3 },
    description: 'One point more than 3 sigma from the centre line.',
  },
  'nelson-2': {
    pattern: { kind: 'sameSide', length: 9 },
    description: 'Nine points in a row on the same side of the centre line (a point on the line breaks the run).',
  },
  'nelson-3': {
    pattern: { kind: 'trend', length: 6 },
    description: 'Six points in a row steadily increasing or steadily decreasing (an equal value breaks the run).',
  },
  'nelson-4': {
    pattern: { kind: 'alternating', length: 14 },
    description: 'Fourteen points in a row alternating up and down (an equal value breaks the run).',
  },
  'nelson-5': {
    pattern: { kind: 'mOfN', m: 2, n: 3, sigmas: 2 },
    description: 'Two out of three points in a row more than 2 sigma from the centre line, on the same side.',
  },
  'nelson-6': {
    pattern: { kind: 'mOfN', m: 4, n: 5, sigmas: 1 },
    description: 'Four out of five points in a row more than 1 sigma from the centre line, on the same side.',
  },
  'nelson-7': {
    pattern: { kind: 'within', length: 15, sigmas: 1 },
    description: 'Fifteen points in a row within 1 sigma of the centre line, on either side.',
  },
  'nelson-8': {
    pattern: { kind: 'outside', length: 8, sigmas: 1 },
    description: 'Eight points in a row more than 1 sigma from the centre line, on either side.',
  },
  'we-1': {
    pattern: { kind: 'beyond', sigmas: 3 },
    description: 'One point more than 3 sigma from the centre line.',
  },
  'we-2': {
    pattern: { kind: 'mOfN', m: 2, n: 3, sigmas: 2 },
    description: 'Two out of three points in a row more than 2 sigma from the centre line, on the same side.',
  },
  'we-3': {
    pattern: { kind: 'mOfN', m: 4, n: 5, sigmas: 1 },
    description: 'Four out of five points in a row more than 1 sigma from the centre line, on the same side.',
  },
  'we-4': {
    pattern: { kind: 'sameSide', length: 8 },
    description: 'Eight points in a row on the same side of the centre line (a point on the line breaks the run).',
  },
};

/** Nelson's eight tests (Nelson 1984, J. Quality Technology 16(4)), in his order. */
export const allNelsonRules: readonly RuleName[] = Object.freeze([
  'nelson-1',
  'nelson-2',
  'nelson-3',
  'nelson-4',
  'nelson-5',
  'nelson-6',
  'nelson-7',
  'nelson-8',
]);

/** The four Western Electric zone rules (Statistical Quality Control Handbook, 1956). */
export const allWesternElectricRules: readonly RuleName[] = Object.freeze(['we-1', 'we-2', 'we-3', 'we-4']);

/** Type guard for rule names coming from callers (API input, stored chart settings). */
export function isRuleName(value: unknown): value is RuleName {
  return typeof value === 'string' && Object.prototype.hasOwnProperty.call(CATALOG, value);
}

/** The pattern behind a rule, as listed in Nelson (1984) / Western Electric (1956). */
export function rulePattern(rule: RuleName): RulePattern {
  return CATALOG[rule].pattern;
}

/** Points a pattern needs before it can be complete. */
export function patternLength(pattern: RulePattern): number {
  switch (pattern.kind) {
    case 'beyond':
      return 1;
    case 'mOfN':
      return pattern.n;
    default:
      return pattern.length;
  }
}

/** Plain-English text of a run rule for the UI (Nelson 1984; Western Electric 1956). */
export function describeRule(rule: RuleName): string {
  if (!isRuleName(rule)) throw new Error(`rule must be one of ${Object.keys(CATALOG).join(', ')}, got ${String(rule)}`);
  return CATALOG[rule].description;
}
