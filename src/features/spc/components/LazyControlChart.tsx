import { lazy, Suspense } from 'react';
import { Spinner } from '../../../components/Spinner';
import type { SpcChartOption } from './ControlChart';

const ControlChart = lazy(() => import('./ControlChart'));

/** ECharts is most of the bundle, so it loads only when a chart is on screen. */
export function LazyControlChart(props: { option: SpcChartOption; height: number; label: string }) {
  return (
    <Suspense fallback={<div style={{ height: props.height }} className="grid place-items-center"><Spinner /></div>}>
      <ControlChart {...props} />
    </Suspense>
  );
}
