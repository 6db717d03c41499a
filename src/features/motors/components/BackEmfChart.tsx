import ReactEChartsCore from 'echarts-for-react/lib/core';
import * as echarts from 'echarts/core';
import { BarChart, LineChart, type BarSeriesOption, type LineSeriesOption } from 'echarts/charts';
import {
  DataZoomComponent, GridComponent, LegendComponent, TooltipComponent,
  type DataZoomComponentOption, type GridComponentOption, type LegendComponentOption, type TooltipComponentOption,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';
import type { WaveformDisplay } from '../api/get-waveform';
import { LINE_COLOURS, LINE_LABELS, LINES } from './phase-lines';

// Only what these two charts draw, so the lazily loaded chunk stays small.
echarts.use([LineChart, BarChart, GridComponent, TooltipComponent, LegendComponent, DataZoomComponent, CanvasRenderer]);

type Option = echarts.ComposeOption<
  LineSeriesOption | BarSeriesOption | GridComponentOption | TooltipComponentOption | LegendComponentOption | DataZoomComponentOption
>;

const axisText = { color: '#555d64', fontFamily: 'IBM Plex Mono, monospace', fontSize: 11 };

function traceOption(display: WaveformDisplay): Option {
  return {
    animation: false,
    grid: { left: 56, right: 16, top: 32, bottom: 64 },
    legend: { top: 0, textStyle: axisText },
    tooltip: { trigger: 'axis', valueFormatter: (value) => `${Number(value).toFixed(1)} V` },
    xAxis: { type: 'value', name: 'ms', nameLocation: 'end', axisLabel: axisText, min: 'dataMin', max: 'dataMax' },
    yAxis: { type: 'value', name: 'V', axisLabel: axisText, splitLine: { lineStyle: { color: '#ece8df' } } },
    // Opens on the first quarter (a few cycles, where the wave shape is readable); slider and
    // wheel/drag zoom reach the rest of the record.
    dataZoom: [{ type: 'inside', xAxisIndex: 0, start: 0, end: 25 }, { type: 'slider', xAxisIndex: 0, height: 20, bottom: 12, start: 0, end: 25 }],
    series: LINES.map((line) => ({
      type: 'line', name: LINE_LABELS[line], data: display.lineToLineV[line], showSymbol: false,
      lineStyle: { width: 1.2, color: LINE_COLOURS[line] }, itemStyle: { color: LINE_COLOURS[line] },
    })),
  };
}

function spectrumOption(display: WaveformDisplay): Option {
  return {
    animation: false,
    grid: { left: 44, right: 8, top: 32, bottom: 36 },
    legend: { top: 0, textStyle: axisText },
    tooltip: { trigger: 'axis', valueFormatter: (value) => `${Number(value).toFixed(2)} %` },
    xAxis: { type: 'category', name: 'order', nameLocation: 'middle', nameGap: 24, data: display.spectrum.map((s) => String(s.order)), axisLabel: axisText },
    yAxis: { type: 'value', name: '% of V₁', axisLabel: axisText, splitLine: { lineStyle: { color: '#ece8df' } } },
    series: LINES.map((line) => ({
      type: 'bar', name: LINE_LABELS[line], data: display.spectrum.map((s) => s[line]), itemStyle: { color: LINE_COLOURS[line] },
    })),
  };
}

/** The three line-to-line back-EMF traces (zoomable) with their harmonic spectrum beside them. */
export default function BackEmfChart({ display }: { display: WaveformDisplay }) {
  return (
    <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
      <figure aria-label="Back-EMF line-to-line voltages" data-testid="back-emf-trace">
        <ReactEChartsCore echarts={echarts} option={traceOption(display)} notMerge style={{ height: 300, width: '100%' }} />
        <figcaption className="text-xs text-graphite-500">
          {display.downsampled
            ? `Shown as a min/max envelope of ${display.samplesPerChannel.toLocaleString('en-US')} samples per line; every value above is computed from all of them.`
            : `All ${display.samplesPerChannel.toLocaleString('en-US')} samples per line.`}
        </figcaption>
      </figure>
      <figure aria-label="Harmonic spectrum" data-testid="back-emf-spectrum">
        <ReactEChartsCore echarts={echarts} option={spectrumOption(display)} notMerge style={{ height: 300, width: '100%' }} />
        <figcaption className="text-xs text-graphite-500">Harmonics 2…25 in percent of each line's fundamental.</figcaption>
      </figure>
    </div>
  );
}
