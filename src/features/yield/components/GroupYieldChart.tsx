import type { YieldGroup } from '../api/yield-schemas';
import type { BoardChartOption } from './BoardChart';
import { chartColours, chartText, groupTooltip, percentAxis } from './chart-style';
import { definitions } from './definitions';
import { LazyBoardChart } from './LazyBoardChart';
import { Panel } from './Panel';

type GroupYieldChartProps = { title: string; groups: YieldGroup[]; target: number; onPick: (key: string) => void };

/** Both yields per line or station, side by side, so a station losing motors to retest stands out. */
export function GroupYieldChart({ title, groups, target, onPick }: GroupYieldChartProps) {
  const height = Math.max(160, 48 + groups.length * 34);
  const option: BoardChartOption = {
    grid: { left: 80, right: 24, top: 8, bottom: 28 },
    tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' }, formatter: (items: unknown) => {
      const index = Array.isArray(items) ? (items[0] as { dataIndex: number }).dataIndex : 0;
      return groups[index] ? groupTooltip(groups[index]) : '';
    } },
    yAxis: { type: 'category', data: groups.map((g) => g.key), inverse: true, axisLabel: { ...chartText, fontFamily: '"IBM Plex Mono", monospace' } },
    xAxis: percentAxis,
    series: [
      {
        name: 'First-pass yield', type: 'bar', data: groups.map((g) => g.firstPassYield), itemStyle: { color: chartColours.firstPass }, barGap: '10%',
        markLine: { symbol: 'none', silent: true, label: { show: false }, lineStyle: { color: chartColours.target, type: 'dashed', width: 2 }, data: [{ xAxis: target }] },
      },
      { name: 'Final yield', type: 'bar', data: groups.map((g) => g.finalYield), itemStyle: { color: chartColours.final } },
    ],
  };
  return (
    <Panel title={title} definition={`${definitions.firstPassYield}. ${definitions.finalYield}.`} hint="copper: first-pass · graphite: final · click a bar for its motors">
      {groups.length === 0
        ? <p className="py-8 text-center text-sm text-graphite-500">No motors tested in this range.</p>
        : <LazyBoardChart option={option} height={height} onPick={(index) => groups[index] && onPick(groups[index].key)} />}
    </Panel>
  );
}
