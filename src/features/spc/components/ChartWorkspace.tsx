import { useState } from 'react';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import type { ChartWindow } from '../api/chart-window';
import { useChart } from '../api/get-chart';
import { CapabilityPanel } from './CapabilityPanel';
import { controlChartOption } from './chart-option';
import { LazyControlChart } from './LazyControlChart';
import { LimitsPanel } from './LimitsPanel';
import { LotSubgroupChart } from './LotSubgroupChart';

/** Everything about one characteristic's control chart: the chart, its limits, lots and capability. */
export function ChartWorkspace({ characteristicId, window }: { characteristicId: number; window: ChartWindow }) {
  const [showSpec, setShowSpec] = useState(true);
  const { data, error, isPending } = useChart(characteristicId, window);
  if (isPending) return <Spinner label="Loading the chart…" size="lg" />;
  if (error) return <ErrorNote error={error} title="Could not load the chart" />;
  const inForce = data.limits.frozen ?? data.limits.trial;
  return (
    <div className="space-y-4">
      <section aria-label="Control chart" className="rounded-md border border-paper-300 bg-white p-4">
        <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
          <h2 className="font-semibold">{data.characteristic.name} <span className="text-graphite-500">({data.characteristic.unit})</span></h2>
          <p className="text-sm" aria-live="polite">
            {data.limits.frozen ? 'Judged against frozen limits' : data.limits.trial ? 'Trial limits — not yet frozen' : 'No control limits yet'}
            {' · '}{data.total} values{data.sampled ? ` (older ones shown as ${data.buckets.length} min/max buckets, the newest ${data.points.length} one by one)` : ''}
          </p>
          <label className="text-sm"><input type="checkbox" checked={showSpec} onChange={(e) => setShowSpec(e.target.checked)} className="mr-1" />Show spec limits</label>
        </div>
        <LazyControlChart option={controlChartOption(data, showSpec)} height={360} label={`Control chart of ${data.characteristic.name}`} />
        {data.violations.length > 0 ? (
          <details className="mt-2 text-sm">
            <summary>{data.violations.length} rule violation(s) on this chart</summary>
            <ul className="mt-1 list-disc pl-5">{data.violations.slice(0, 50).map((v) => <li key={`${v.runId}-${v.rule}`}>Run {v.runId}: {v.ruleText}</li>)}</ul>
          </details>
        ) : null}
      </section>
      <LimitsPanel data={data} window={window} />
      <LotSubgroupChart characteristicId={characteristicId} limits={inForce} window={window} />
      <CapabilityPanel characteristicId={characteristicId} window={window} />
    </div>
  );
}
