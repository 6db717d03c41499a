import { formatCount, formatPercent } from '../../../lib/format';
import type { YieldGroup } from '../api/yield-schemas';

// The board's chart palette, taken from the app's own theme (tailwind.config.ts).
export const chartColours = {
  firstPass: '#b8733a', // copper-500
  final: '#3d444a', // graphite-600
  target: '#2f7d4f', // pass
  failures: '#9c5e2e', // copper-600
  axis: '#737b82', // graphite-400
  grid: '#ece8df', // paper-200
} as const;

export const chartText = { fontFamily: '"IBM Plex Sans", system-ui, sans-serif', color: chartColours.axis };

/** Tooltip text of a yield group: both yields with the count behind them. */
export function groupTooltip(group: YieldGroup): string {
  return [
    `<b>${group.key}</b>`,
    `First-pass yield ${formatPercent(group.firstPassYield)} (${formatCount(group.passedFirst)} of ${formatCount(group.tested)})`,
    `Final yield ${formatPercent(group.finalYield)} (${formatCount(group.passedFinal)} of ${formatCount(group.tested)})`,
    'Click for the motors',
  ].join('<br/>');
}

export const percentAxis = {
  type: 'value' as const,
  min: (extent: { min: number }) => Math.max(0, Math.floor(extent.min * 10) / 10 - 0.1),
  max: 1,
  axisLabel: { formatter: (v: number) => `${Math.round(v * 100)} %`, ...chartText },
  splitLine: { lineStyle: { color: chartColours.grid } },
};
