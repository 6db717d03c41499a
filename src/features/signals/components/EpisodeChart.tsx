import ReactEChartsCore from 'echarts-for-react/lib/core';
import * as echarts from 'echarts/core';
import { LineChart, ScatterChart } from 'echarts/charts';
import { DataZoomComponent, GridComponent, MarkAreaComponent, MarkLineComponent, TooltipComponent } from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';
import type { SignalDetail } from '../api/signal-schemas';

echarts.use([LineChart, ScatterChart, GridComponent, TooltipComponent, MarkLineComponent, MarkAreaComponent, DataZoomComponent, CanvasRenderer]);

/** The values around the episode, the limits it was judged against, the episode shaded. Lazy-loaded. */
export default function EpisodeChart({ detail }: { detail: SignalDetail }) {
  const episode = new Set(detail.episode.runIds);
  const option = {
    animation: false,
    grid: { left: 64, right: 80, top: 24, bottom: 56 },
    tooltip: { trigger: 'axis' },
    xAxis: { type: 'value', name: 'run', min: 'dataMin', max: 'dataMax' },
    yAxis: { type: 'value', name: detail.signal.unit, scale: true },
    dataZoom: [{ type: 'inside' }, { type: 'slider', height: 18, bottom: 12 }],
    series: [
      {
        type: 'line', name: detail.signal.characteristicName, data: detail.series.map((p) => [p.runId, p.value]), symbolSize: 4,
        lineStyle: { color: '#3b4350', width: 1 }, itemStyle: { color: '#3b4350' },
        markLine: { symbol: 'none', silent: true, data: [
          { name: 'UCL', yAxis: detail.limits.ucl, label: { formatter: 'UCL', position: 'end' }, lineStyle: { color: '#b5512a' } },
          { name: 'Centre', yAxis: detail.limits.centre, label: { formatter: 'Centre', position: 'end' }, lineStyle: { color: '#2f7d4f' } },
          { name: 'LCL', yAxis: detail.limits.lcl, label: { formatter: 'LCL', position: 'end' }, lineStyle: { color: '#b5512a' } },
        ] },
        markArea: { silent: true, itemStyle: { color: 'rgba(210,154,18,0.15)' }, data: [[{ xAxis: detail.episode.patternFirstRunId }, { xAxis: detail.episode.lastRunId }]] },
      },
      { type: 'scatter', name: 'Episode point', symbol: 'diamond', symbolSize: 11, itemStyle: { color: '#c42b2f' },
        data: detail.series.filter((p) => episode.has(p.runId)).map((p) => [p.runId, p.value]) },
    ],
  };
  return (
    <div role="img" aria-label={`Control chart around signal ${detail.signal.id}`}>
      <ReactEChartsCore echarts={echarts} option={option} notMerge style={{ height: 320, width: '100%' }} />
    </div>
  );
}
