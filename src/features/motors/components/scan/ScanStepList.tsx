import { VerdictBadge } from '../../../../components/VerdictBadge';
import { formatNumber } from '../../../../lib/format';
import type { Measurement } from '../../api/motor-schemas';
import { LimitBar } from '../LimitBar';
import { displayUnit, formatLimits } from '../limits';

/** Failing steps first; otherwise the station's own order. */
const failingFirst = (results: Measurement[]) =>
  results.map((result, index) => ({ result, index })).sort((a, b) => {
    const rank = (m: Measurement) => (m.verdict === 'fail' ? 0 : 1);
    return rank(a.result) - rank(b.result) || a.index - b.index;
  });

/** Each test step of one run: what was measured, the value, the limits, and where the value sits. */
export function ScanStepList({ results }: { results: Measurement[] }) {
  if (results.length === 0) return <p className="text-lg text-graphite-600">This run reported no measurements.</p>;
  return (
    <ol aria-label="Test steps" className="divide-y divide-paper-300 rounded-lg border border-paper-300 bg-white">
      {failingFirst(results).map(({ result }) => (
        <li
          key={result.characteristic}
          data-verdict={result.verdict}
          className={`grid grid-cols-[1fr_auto] items-center gap-x-4 gap-y-2 px-4 py-3 sm:grid-cols-[minmax(0,16rem)_1fr_auto] ${result.verdict === 'fail' ? 'bg-fail-soft/60' : ''}`}
        >
          <div className="min-w-0">
            <p className="text-lg leading-snug font-semibold text-graphite-950">{result.name}</p>
            <p className="text-sm text-graphite-500">{result.testStep ?? result.characteristic}</p>
          </div>
          <div className="col-span-2 row-start-2 sm:col-span-1 sm:row-start-auto">
            <div className="flex items-baseline justify-between gap-3">
              <span className="figures text-2xl font-semibold text-graphite-950">
                {formatNumber(result.value, { unit: displayUnit(result.unit) })}
              </span>
              <span className="figures text-base text-graphite-600">{formatLimits(result)}</span>
            </div>
            <LimitBar {...result} className="mt-1 h-5 w-full" />
          </div>
          <div className="col-start-2 row-start-1 sm:col-start-auto sm:row-start-auto">
            <VerdictBadge verdict={result.verdict} size="md" />
          </div>
        </li>
      ))}
    </ol>
  );
}
