import { allNelsonRules, individualsChart, ruleViolations } from '../server/analysis/index.js';
import { medianMs } from './stats.js';

function normalSeries(count: number, seed: number): number[] {
  let s = seed >>> 0;
  const uniform = () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return (s + 0.5) / 4294967296;
  };
  return Array.from({ length: count }, () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform()) * 2 + 100);
}

/** Individuals chart plus all eight Nelson rules over 100k points (target ≤ 100 ms). */
export async function benchSpcRules() {
  const values = normalSeries(100_000, 7);
  const ms = await medianMs(() => {
    const chart = individualsChart(values);
    return ruleViolations(values, { center: chart.center, sigma: chart.sigma }, [...allNelsonRules]);
  }, 15);
  return { points: values.length, individualsPlusNelsonMedianMs: ms, target: '≤ 100 ms' };
}
