/**
 * Statistical process control for Fluxtrail: chart constants, Shewhart, EWMA and CUSUM charts,
 * Nelson / Western Electric run rules and capability. Pure functions: numbers in, results out.
 */
export { controlChartConstants, type ControlChartConstants } from './constants.js';
export type { ControlLimits, SubgroupMeanLimits } from './types.js';
export { individualsChart, type IndividualsChart } from './individuals.js';
export { xbarRChart, type XbarRChart, type XbarRSubgroupLimits } from './xbarR.js';
export { xbarSChart, type XbarSChart, type XbarSSubgroupLimits } from './xbarS.js';
export { ewmaChart, type EwmaChart, type EwmaOptions, type EwmaPoint } from './ewma.js';
export { cusumChart, type CusumChart, type CusumOptions, type CusumSignal } from './cusum.js';
export { allNelsonRules, allWesternElectricRules, describeRule, type RuleName } from './ruleCatalog.js';
export { ruleViolations, ruleViolationsAt, ruleWindowLength, type RuleLimits, type RuleViolation } from './rules.js';
export {
  capability,
  cpkConfidenceInterval,
  type CapabilityOptions,
  type CapabilityStudy,
} from './capability.js';
export { andersonDarlingNormality, type AndersonDarlingResult } from './andersonDarling.js';
export { normalCdf } from './normal.js';
