import { formatPercent } from '../../../lib/format';
import type { YieldGroup } from '../api/yield-schemas';
import type { BoardChartOption } from './BoardChart';
import { chartColours, chartText, groupTooltip, percentAxis } from './chart-style';
import { definitions } from './definitions';
import { LazyBoardChart } from './LazyBoardChart';
import { Panel } from './Panel';

type DailyTrendProps = { days: YieldGroup[]; target: number; onPick: (day: string) => void };

/** First-pass yield per production day as bars, final yield as a line, the target as a dashed rule. */
export function DailyTrend({ days, target, onPick }: DailyTrendProps) {
  const option: BoardChartOption = {
    grid: { left: 48, right: 16, top: 24, bottom: 32 },
    tooltip: { trigger: 'axis', formatter: (items: unknown) => {
      const index = Array.isArray(items) ? (items[0] as { dataIndex: number }).dataIndex : 0;
      return days[index] ? groupTooltip(days[index]) : '';
    } },
    xAxis: { type: 'category', data: days.map((d) => d.key.slice(5)), axisLabel: chartText },
    yAxis: percentAxis,
    series: [
      {
        name: 'First-pass yield', type: 'bar', data: days.map((d) => d.firstPassYield), itemStyle: { color: chartColours.firstPass },
        markLine: {
          symbol: 'none', silent: true, lineStyle: { color: chartColours.target, type: 'dashed', width: 2 },
          label: { formatter: `target ${formatPercent(target, 0)}`, color: chartColours.target, position: 'insideEndTop' },
          data: [{ yAxis: target }],
        },
      },
      { name: 'Final yield', type: 'line', data: days.map((d) => d.finalYield), itemStyle: { color: chartColours.final }, lineStyle: { width: 1.5 }, symbolSize: 5 },
    ],
  };
  return (
    <Panel
      title="First-pass yield by day"
      definition={`${definitions.firstPassYield}. ${definitions.target}.`}
      hint={<><Key colour={chartColours.firstPass} label="first-pass (bars)" /> <Key colour={chartColours.final} label="final (line)" /> <Key colour={chartColours.target} label={`target ${formatPercent(target, 0)} (dashed)`} /></>}
    >
      <LazyBoardChart option={option} height={260} onPick={(index) => days[index] && onPick(days[index].key)} />
    </Panel>
  );
}

function Key({ colour, label }: { colour: string; label: string }) {
  return (
    <span className="ml-3 inline-flex items-center gap-1">
      <span aria-hidden className="inline-block h-2 w-3 rounded-sm" style={{ background: colour }} />
      {label}
    </span>
  );
}
