import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { useCapability } from '../api/get-capability';
import type { ChartWindow } from '../api/chart-window';
import type { CapabilityData } from '../api/spc-schemas';
import { LazyControlChart } from './LazyControlChart';
import type { SpcChartOption } from './ControlChart';

const fmt = (v: number | null) => (v === null ? '—' : v.toFixed(2));

function histogramOption(data: CapabilityData): SpcChartOption {
  const bars = data.histogram ?? [];
  const lines = [data.spec?.lsl, data.spec?.usl].filter((v): v is number => typeof v === 'number');
  return {
    animation: false,
    grid: { left: 48, right: 24, top: 16, bottom: 32 },
    tooltip: { trigger: 'axis' },
    xAxis: { type: 'value', scale: true },
    yAxis: { type: 'value', name: 'count' },
    series: [
      { type: 'bar', name: 'values', data: bars.map((b) => [(b.from + b.to) / 2, b.count]), barWidth: '90%', itemStyle: { color: '#8a94a3' },
        markLine: { symbol: 'none', silent: true, data: lines.map((x, i) => ({ xAxis: x, name: i === 0 && data.spec?.lsl === x ? 'LSL' : 'USL', label: { formatter: '{b}' }, lineStyle: { color: '#6b4e00', type: 'dashed' } })) } },
      { type: 'line', name: 'fitted normal', data: (data.curve ?? []).map((c) => [c.x, c.count]), showSymbol: false, smooth: true, lineStyle: { color: '#b5512a' } },
    ],
  };
}

/** Capability of all data of the characteristic (AIAG indices with Bissell 95 % bounds on Cpk). */
export function CapabilityPanel({ characteristicId, window }: { characteristicId: number; window: ChartWindow }) {
  const { data, error, isPending } = useCapability(characteristicId, window);
  if (isPending) return <Spinner label="Computing capability…" />;
  if (error) return <ErrorNote error={error} title="Could not compute capability" />;
  const study = data.study;
  return (
    <section aria-label="Capability" className="rounded-md border border-paper-300 bg-white p-4">
      <h3 className="font-semibold">Capability ({data.n} values)</h3>
      {!study ? <p className="text-sm text-graphite-500">Not available: {data.reason}</p> : (
        <>
          {data.normal === false ? (
            <p role="alert" className="my-2 rounded border border-hold/50 bg-hold-soft px-3 py-2 text-sm">
              The data does not look normal (Anderson–Darling p = {study.normality.pValue.toPrecision(2)}): Cp/Cpk and the ppm estimate assume a normal distribution and may mislead.
            </p>
          ) : null}
          <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-6">
            <dt className="text-graphite-500">Cp</dt><dd className="figures">{fmt(study.cp)}</dd>
            <dt className="text-graphite-500">Cpk (95 %)</dt><dd className="figures">{fmt(study.cpk)} ({fmt(study.cpkLower95)}–{fmt(study.cpkUpper95)})</dd>
            <dt className="text-graphite-500">Pp</dt><dd className="figures">{fmt(study.pp)}</dd>
            <dt className="text-graphite-500">Ppk</dt><dd className="figures">{fmt(study.ppk)}</dd>
            <dt className="text-graphite-500">Expected out of spec</dt><dd className="figures">{study.ppmOutOfSpec.toFixed(0)} ppm</dd>
          </dl>
          <LazyControlChart option={histogramOption(data)} height={220} label="Histogram with fitted normal curve and specification limits" />
        </>
      )}
    </section>
  );
}
