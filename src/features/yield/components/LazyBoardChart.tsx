import { lazy, Suspense, type ComponentProps } from 'react';
import { Spinner } from '../../../components/Spinner';

// ECharts is most of the client bundle; the board fetches it only when a chart is shown.
const BoardChart = lazy(() => import('./BoardChart'));

export function LazyBoardChart(props: ComponentProps<typeof BoardChart>) {
  return (
    <Suspense fallback={<div className="flex items-center justify-center" style={{ height: props.height }}><Spinner label="Drawing the chart…" /></div>}>
      <BoardChart {...props} />
    </Suspense>
  );
}
