import { Link } from 'react-router-dom';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { formatCount, formatDateTime } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useYieldMotors, type YieldDrill } from '../api/get-yield-motors';
import type { YieldFilter } from '../api/yield-schemas';

const groupWords: Record<string, string> = {
  day: 'first tested on', week: 'first tested in week', shift: 'first tested in shift', line: 'first tested on line',
  station: 'first tested on station', product: 'of product', lot: 'of lot',
};

export function describeDrill(drill: YieldDrill): string {
  return 'characteristic' in drill ? `whose first test failed ${drill.characteristic}` : `${groupWords[drill.groupBy]} ${drill.key}`;
}

function Verdict({ verdict }: { verdict: 'pass' | 'fail' }) {
  // A shape and a word besides the colour, so the verdict reads without colour too.
  return verdict === 'pass'
    ? <span className="text-pass-ink"><span aria-hidden>● </span>pass</span>
    : <span className="text-fail-ink"><span aria-hidden>▲ </span>fail</span>;
}

type DrillListProps = { filter: YieldFilter; drill: YieldDrill; onClose: () => void };

/** The motors behind the bar that was clicked, newest first test first. */
export function DrillList({ filter, drill, onClose }: DrillListProps) {
  const motors = useYieldMotors(filter, drill);
  return (
    <section className="rounded-lg border border-copper-300 bg-white p-4" aria-label="Motors behind the selected bar" data-testid="yield-drill">
      <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-sm font-semibold text-graphite-900">
          Motors {describeDrill(drill)}
          {motors.data ? <span className="figures ml-2 font-normal text-graphite-500">{formatCount(motors.data.total)} motors</span> : null}
        </h2>
        <button type="button" className="text-sm text-graphite-600 hover:underline" onClick={onClose}>Close list</button>
      </header>
      {motors.isPending ? <Spinner label="Finding the motors…" /> : null}
      {motors.isError ? <ErrorNote error={motors.error} title="Could not list the motors" /> : null}
      {motors.data ? (
        <div className="max-h-96 overflow-auto">
          <table className="w-full text-sm">
            <thead className="sticky top-0 bg-white text-left text-xs text-graphite-500">
              <tr>
                <th className="py-1 font-medium">Serial</th><th className="py-1 font-medium">Product</th><th className="py-1 font-medium">Lot</th>
                <th className="py-1 font-medium">First station</th><th className="py-1 font-medium">First test</th>
                <th className="py-1 font-medium">First verdict</th><th className="py-1 font-medium">Latest verdict</th><th className="py-1 text-right font-medium">Attempts</th>
              </tr>
            </thead>
            <tbody>
              {motors.data.motors.map((m) => (
                <tr key={m.serial} className="border-t border-paper-200">
                  <td className="py-1"><Link className="figures text-copper-700 hover:underline" to={paths.motorRecord.href(m.serial)}>{m.serial}</Link></td>
                  <td className="figures py-1">{m.product}</td>
                  <td className="figures py-1">{m.lot}</td>
                  <td className="figures py-1">{m.station} <span className="text-graphite-500">({m.line})</span></td>
                  <td className="figures py-1">{formatDateTime(m.firstTestedAt)}</td>
                  <td className="py-1"><Verdict verdict={m.firstVerdict} /></td>
                  <td className="py-1"><Verdict verdict={m.finalVerdict} /></td>
                  <td className="figures py-1 text-right">{m.attempts}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {motors.data.total > motors.data.motors.length
            ? <p className="mt-2 text-xs text-graphite-500">Showing the latest {motors.data.motors.length} of {formatCount(motors.data.total)}. Narrow the dates to see the rest.</p>
            : null}
        </div>
      ) : null}
    </section>
  );
}
