import ReactEChartsCore from 'echarts-for-react/lib/core';
import * as echarts from 'echarts/core';
import { BarChart, LineChart, ScatterChart, type BarSeriesOption, type LineSeriesOption, type ScatterSeriesOption } from 'echarts/charts';
import {
  DataZoomComponent, GridComponent, MarkLineComponent, TooltipComponent,
  type DataZoomComponentOption, type GridComponentOption, type MarkLineComponentOption, type TooltipComponentOption,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';

// Only what the control chart and the histogram draw, so the lazily loaded chunk stays small.
echarts.use([LineChart, ScatterChart, BarChart, GridComponent, TooltipComponent, MarkLineComponent, DataZoomComponent, CanvasRenderer]);

export type SpcChartOption = echarts.ComposeOption<
  LineSeriesOption | ScatterSeriesOption | BarSeriesOption | GridComponentOption | TooltipComponentOption | MarkLineComponentOption | DataZoomComponentOption
>;

/** One ECharts canvas; loaded on demand by LazyControlChart. */
export default function ControlChart({ option, height, label }: { option: SpcChartOption; height: number; label: string }) {
  return (
    <div role="img" aria-label={label}>
      <ReactEChartsCore echarts={echarts} option={option} notMerge style={{ height, width: '100%' }} />
    </div>
  );
}
