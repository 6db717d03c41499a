import { lazy, Suspense } from 'react';
import { Link } from 'react-router-dom';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { paths } from '../../../lib/paths';
import { useSignal } from '../api/get-signal';
import { SignalActions } from './SignalActions';

const EpisodeChart = lazy(() => import('./EpisodeChart'));

/** One signal: what broke, where, the chart around it, the motors produced since, and the actions. */
export function SignalRecord({ id }: { id: string }) {
  const { data, error, isPending } = useSignal(id);
  if (isPending) return <Spinner label="Loading the signal…" size="lg" />;
  if (error) return <ErrorNote error={error} title="Could not load the signal" />;
  const { signal } = data;
  return (
    <div className="space-y-4">
      <section aria-label="What happened" className="rounded-md border border-paper-300 bg-white p-4">
        <p className="text-lg font-semibold">Status: <span data-testid="signal-status">{signal.status}</span></p>
        <p className="mt-1">{signal.ruleText}</p>
        <dl className="mt-2 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
          <dt className="text-graphite-500">Product</dt><dd>{signal.product}</dd>
          <dt className="text-graphite-500">Characteristic</dt><dd>{signal.characteristicName} ({signal.unit})</dd>
          <dt className="text-graphite-500">Lot(s)</dt><dd>{data.lots.map((lot) => <Link key={lot} to={paths.lot.href(lot)} className="mr-2 underline">{lot}</Link>)}</dd>
          <dt className="text-graphite-500">Limits</dt><dd>{data.limits.status} ({data.limits.chartKind})</dd>
          <dt className="text-graphite-500">Assigned to</dt><dd>{signal.assignee?.name ?? 'nobody yet'}</dd>
          <dt className="text-graphite-500">Opened</dt><dd className="figures">{signal.openedAt.slice(0, 16).replace('T', ' ')}</dd>
          {signal.closed ? <><dt className="text-graphite-500">Disposition</dt><dd>{signal.closed.outcome}: {signal.closed.cause} — {signal.closed.actionTaken}</dd></> : null}
        </dl>
      </section>
      <Suspense fallback={<Spinner label="Loading the chart…" />}><EpisodeChart detail={data} /></Suspense>
      <SignalActions signal={signal} />
      <section aria-label="Motors since the first violating point" className="rounded-md border border-paper-300 bg-white p-4">
        <h2 className="font-semibold">Motors tested since the first violating point ({data.motors.length})</h2>
        <table className="mt-2 w-full text-left text-sm">
          <thead className="text-graphite-500"><tr><th className="py-1">Serial</th><th>Lot</th><th>Status</th><th>Held by this signal</th></tr></thead>
          <tbody>
            {data.motors.map((m) => (
              <tr key={m.id} className="border-t border-paper-200">
                <td className="py-1"><Link to={paths.motorRecord.href(m.serial)} className="underline">{m.serial}</Link></td>
                <td>{m.lot}</td><td>{m.status}</td><td>{m.heldBySignal ? 'yes' : 'no'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}
