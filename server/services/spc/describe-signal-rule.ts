import { describeRule, type RuleName } from '../../analysis/spc/index.js';
import { defaultRules, selectableRules, type ChartRule, type SignalRule } from './chart-kinds.js';

const chartRuleText: Record<ChartRule, string> = {
  'ewma-beyond': 'The EWMA of the values moved outside its control limits.',
  'cusum-upper': 'The upper CUSUM sum passed the decision interval: the mean has shifted up.',
  'cusum-lower': 'The lower CUSUM sum passed the decision interval: the mean has shifted down.',
};

export function isSignalRule(value: string): value is SignalRule {
  return (selectableRules as readonly string[]).includes(value) || Object.prototype.hasOwnProperty.call(chartRuleText, value);
}

/** Plain words for any rule a signal can carry. */
export function describeSignalRule(rule: SignalRule): string {
  if (Object.prototype.hasOwnProperty.call(chartRuleText, rule)) return chartRuleText[rule as ChartRule];
  return describeRule(rule as RuleName);
}

/** The run rules an engineer may pick for trial limits, each in plain words, the defaults marked. */
export function ruleChoices() {
  return { rules: selectableRules.map((rule) => ({ rule, text: describeRule(rule), family: rule.startsWith('nelson') ? 'nelson' : 'western-electric', isDefault: defaultRules.includes(rule) })) };
}
