import ReactEChartsCore from 'echarts-for-react/lib/core';
import * as echarts from 'echarts/core';
import { BarChart, LineChart, type BarSeriesOption, type LineSeriesOption } from 'echarts/charts';
import {
  GridComponent, MarkLineComponent, TooltipComponent,
  type GridComponentOption, type MarkLineComponentOption, type TooltipComponentOption,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';

// Only the parts the board draws, so the lazily loaded chart chunk stays small.
echarts.use([BarChart, LineChart, GridComponent, TooltipComponent, MarkLineComponent, CanvasRenderer]);

export type BoardChartOption = echarts.ComposeOption<
  BarSeriesOption | LineSeriesOption | GridComponentOption | TooltipComponentOption | MarkLineComponentOption
>;

type BoardChartProps = {
  option: BoardChartOption;
  height: number;
  /** Called with the category index of a clicked bar or point. */
  onPick: (index: number) => void;
};

/** One ECharts canvas of the board; loaded on demand by LazyBoardChart. */
export default function BoardChart({ option, height, onPick }: BoardChartProps) {
  return (
    <ReactEChartsCore
      echarts={echarts}
      // No animation: a board that refreshes every minute should not redraw itself from zero.
      option={{ animation: false, ...option }}
      notMerge
      style={{ height, width: '100%', cursor: 'pointer' }}
      onEvents={{ click: (event: { dataIndex: number }) => onPick(event.dataIndex) }}
    />
  );
}
