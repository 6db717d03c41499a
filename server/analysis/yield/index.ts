/** Yield metrics for the quality dashboards: pure functions of counts and station yields. */
export { firstPassYield, finalYield, summarizeAttempts } from './counts.js';
export type { Verdict } from './counts.js';
export { rolledThroughputYield, dpmo } from './process.js';
