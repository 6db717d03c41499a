import { formatCount, formatPercent } from '../../../lib/format';
import type { ParetoEntry } from '../api/get-yield';
import type { BoardChartOption } from './BoardChart';
import { chartColours, chartText } from './chart-style';
import { definitions } from './definitions';
import { LazyBoardChart } from './LazyBoardChart';
import { Panel } from './Panel';

type ParetoPanelProps = { entries: ParetoEntry[]; selected: string | null; onPick: (characteristic: string) => void };

const cumulative = (entries: ParetoEntry[]) => entries.reduce<number[]>((acc, e) => [...acc, (acc[acc.length - 1] ?? 0) + e.share], []);

/** Failing characteristics on first attempts, most first, with the running share as a line. */
export function ParetoPanel({ entries, selected, onPick }: ParetoPanelProps) {
  const running = cumulative(entries);
  const option: BoardChartOption = {
    grid: { left: 48, right: 48, top: 16, bottom: 56 },
    tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } },
    xAxis: { type: 'category', data: entries.map((e) => e.characteristic), axisLabel: { ...chartText, rotate: 30, fontFamily: '"IBM Plex Mono", monospace' } },
    yAxis: [
      { type: 'value', name: 'failures', nameTextStyle: chartText, minInterval: 1, axisLabel: chartText, splitLine: { lineStyle: { color: chartColours.grid } } },
      { type: 'value', min: 0, max: 1, axisLabel: { formatter: (v: number) => `${Math.round(v * 100)} %`, ...chartText }, splitLine: { show: false } },
    ],
    series: [
      { name: 'Failures', type: 'bar', data: entries.map((e) => e.failures), itemStyle: { color: chartColours.failures } },
      { name: 'Running share', type: 'line', yAxisIndex: 1, data: running, itemStyle: { color: chartColours.final }, symbolSize: 5, tooltip: { valueFormatter: (v) => formatPercent(Number(v)) } },
    ],
  };
  return (
    <Panel title="Where first tests fail (Pareto)" definition={definitions.pareto} hint="click a bar or a row for the motors">
      {entries.length === 0 ? <p className="py-8 text-center text-sm text-graphite-500">No failing measurements on first attempts in this range.</p> : (
        <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
          <LazyBoardChart option={option} height={280} onPick={(index) => entries[index] && onPick(entries[index].characteristic)} />
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-graphite-500">
              <tr><th className="py-1 font-medium">Characteristic</th><th className="py-1 text-right font-medium">Failures</th><th className="py-1 text-right font-medium">Share</th><th className="py-1 text-right font-medium">Running</th></tr>
            </thead>
            <tbody>
              {entries.map((entry, i) => (
                <tr key={entry.characteristic} className={`border-t border-paper-200 ${selected === entry.characteristic ? 'bg-copper-50' : ''}`}>
                  <td className="py-1">
                    <button type="button" className="figures text-left text-copper-700 underline-offset-2 hover:underline" onClick={() => onPick(entry.characteristic)}
                      aria-pressed={selected === entry.characteristic} title={`${entry.name}: show the motors whose first test failed it`}>
                      {entry.characteristic}
                    </button>
                  </td>
                  <td className="figures py-1 text-right">{formatCount(entry.failures)}</td>
                  <td className="figures py-1 text-right">{formatPercent(entry.share)}</td>
                  <td className="figures py-1 text-right text-graphite-500">{formatPercent(running[i])}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
