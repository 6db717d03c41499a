import {
  allNelsonRules,
  allWesternElectricRules,
  isRuleName,
  patternLength,
  rulePattern,
  type RuleName,
} from './ruleCatalog.js';
import { detectPattern } from './ruleDetectors.js';
import { requireFinite, requireFiniteArray, requirePositive } from './validate.js';

export interface RuleLimits {
  center: number;
  sigma: number;
}

export interface RuleViolation {
  rule: RuleName;
  /** the point at which the pattern is completed */
  index: number;
  /** indices of the points that make up the pattern, ascending */
  points: number[];
}

/** The longest trailing window any rule needs (Nelson 7, fifteen points). */
export const ruleWindowLength: number = Math.max(
  ...[...allNelsonRules, ...allWesternElectricRules].map((rule) => patternLength(rulePattern(rule))),
);

function checkArguments(name: string, points: readonly number[], limits: RuleLimits, rules: readonly RuleName[]): RuleName[] {
  requireFiniteArray(name, points, 0);
  if (limits === null || typeof limits !== 'object') throw new Error('limits must be an object with center and sigma');
  requireFinite('limits.center', limits.center);
  requirePositive('limits.sigma', limits.sigma);
  if (!Array.isArray(rules)) throw new Error('rules must be an array of rule names');
  rules.forEach((rule, i) => {
    if (!isRuleName(rule)) throw new Error(`rules[${i}] is not a known rule: ${String(rule)}`);
  });
  return [...new Set(rules)];
}

/**
 * Run-rule violations: Nelson's eight tests (Nelson 1984, J. Quality Technology 16(4)) and the
 * Western Electric rules (Statistical Quality Control Handbook, 1956), each selectable, in one
 * O(n) pass per rule. Every point at which a pattern is completed is reported, so a run of 10
 * on one side gives Nelson 2 at its 9th and 10th points. Sorted by index, then by the order of
 * `rules`. Ties follow the conventions in ruleCatalog.ts.
 */
export function ruleViolations(points: readonly number[], limits: RuleLimits, rules: readonly RuleName[]): RuleViolation[] {
  const selected = checkArguments('points', points, limits, rules);
  const found: RuleViolation[] = [];
  for (const rule of selected) {
    detectPattern(rulePattern(rule), points, limits.center, limits.sigma, (index, pattern) => {
      found.push({ rule, index, points: pattern });
    });
  }
  // Array.prototype.sort is stable (ES2019), so within an index the order of `rules` is kept.
  return found.sort((a, b) => a.index - b.index);
}

/**
 * Incremental form for ingest: the rules broken at the last point of a trailing window, with
 * indices relative to the window. A window of `ruleWindowLength` (15) points, or the whole
 * series while it is shorter, gives the same answer as `ruleViolations` on the full series.
 */
export function ruleViolationsAt(window: readonly number[], limits: RuleLimits, rules: readonly RuleName[]): RuleViolation[] {
  const selected = checkArguments('window', window, limits, rules);
  const last = window.length - 1;
  const found: RuleViolation[] = [];
  for (const rule of selected) {
    detectPattern(rulePattern(rule), window, limits.center, limits.sigma, (index, pattern) => {
      if (index === last) found.push({ rule, index, points: pattern });
    });
  }
  return found;
}
