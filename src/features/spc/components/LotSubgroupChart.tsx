import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { useSubgroups } from '../api/get-subgroups';
import type { ChartWindow } from '../api/chart-window';
import type { Limits } from '../api/spc-schemas';
import { LazyControlChart } from './LazyControlChart';

/** Mean of each lot, with the limits of an X̄ chart for that lot's size when lot limits are in force. */
export function LotSubgroupChart({ characteristicId, limits, window }: { characteristicId: number; limits: Limits | null; window: ChartWindow }) {
  const { data, error, isPending } = useSubgroups(characteristicId, window);
  if (isPending) return <Spinner label="Loading lot subgroups…" />;
  if (error) return <ErrorNote error={error} title="Could not load lot subgroups" />;
  const byLot = limits?.chartKind === 'xbar-s-lot' ? limits : null;
  const band = (n: number, sign: 1 | -1) => (byLot ? byLot.centre + sign * 3 * byLot.sigma / Math.sqrt(n) : null);
  return (
    <section aria-label="Lot subgroups" className="rounded-md border border-paper-300 bg-white p-4">
      <h3 className="font-semibold">Lot means ({data.lots.length} lots)</h3>
      <LazyControlChart
        height={240}
        label="Mean of each lot"
        option={{
          animation: false, grid: { left: 64, right: 24, top: 16, bottom: 48 }, tooltip: { trigger: 'axis' },
          xAxis: { type: 'category', data: data.lots.map((l) => l.lot) }, yAxis: { type: 'value', scale: true },
          series: [
            { type: 'line', name: 'lot mean', data: data.lots.map((l) => l.mean), lineStyle: { color: '#3b4350' }, itemStyle: { color: '#3b4350' } },
            ...(byLot ? [
              { type: 'line' as const, name: 'UCL', step: 'middle' as const, showSymbol: false, data: data.lots.map((l) => band(l.n, 1)), lineStyle: { color: '#b5512a' } },
              { type: 'line' as const, name: 'LCL', step: 'middle' as const, showSymbol: false, data: data.lots.map((l) => band(l.n, -1)), lineStyle: { color: '#b5512a' } },
            ] : []),
          ],
        }}
      />
    </section>
  );
}
