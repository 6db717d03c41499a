import { lazy, Suspense, type ComponentProps } from 'react';
import { Spinner } from '../../../components/Spinner';

// ECharts is most of the client bundle; the Motor record fetches it only when a waveform is shown.
const BackEmfChart = lazy(() => import('./BackEmfChart'));

export function LazyBackEmfChart(props: ComponentProps<typeof BackEmfChart>) {
  return (
    <Suspense fallback={<div className="flex h-[300px] items-center justify-center"><Spinner label="Drawing the waveform…" /></div>}>
      <BackEmfChart {...props} />
    </Suspense>
  );
}
