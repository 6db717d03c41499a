import { Link, useSearchParams } from 'react-router-dom';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { paths } from '../../../lib/paths';
import { useSignals } from '../api/get-signals';
import { signalStatuses, type SignalStatus } from '../api/signal-schemas';

const statusNames: Record<SignalStatus, string> = { open: 'Open', acknowledged: 'Acknowledged', contained: 'Contained', closed: 'Closed' };

/** The inbox of SPC signals with its three filters, kept in the URL so a filtered view can be shared. */
export function SignalInbox() {
  const [params, setParams] = useSearchParams();
  const status = (params.get('status') as SignalStatus | null) ?? undefined;
  const product = params.get('product') ?? undefined;
  const characteristicId = params.get('characteristic') ? Number(params.get('characteristic')) : undefined;
  const { data, error, isPending } = useSignals({ status, product, characteristicId });
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value); else next.delete(key);
    setParams(next);
  };
  return (
    <div className="space-y-4">
      <nav aria-label="Signal status" className="flex flex-wrap gap-2">
        {[undefined, ...signalStatuses].map((s) => (
          <button key={s ?? 'all'} type="button" aria-pressed={status === s} onClick={() => set('status', s ?? '')}
            className={`rounded-full border px-3 py-1 text-sm ${status === s ? 'border-graphite-900 bg-graphite-900 text-white' : 'border-graphite-300 bg-white'}`}>
            {s ? statusNames[s] : 'All'}{s && data?.counts[s] !== undefined ? ` (${data.counts[s]})` : ''}
          </button>
        ))}
      </nav>
      <div className="flex flex-wrap gap-4">
        <label className="text-sm">Product <input aria-label="Filter by product" defaultValue={product} onBlur={(e) => set('product', e.target.value.trim())} className="ml-1 w-32 rounded border border-graphite-300 px-2 py-1" /></label>
        <label className="text-sm">Characteristic id <input aria-label="Filter by characteristic" defaultValue={characteristicId} onBlur={(e) => set('characteristic', e.target.value.trim())} inputMode="numeric" className="ml-1 w-24 rounded border border-graphite-300 px-2 py-1" /></label>
      </div>
      {isPending ? <Spinner label="Loading signals…" /> : error ? <ErrorNote error={error} title="Could not load signals" /> : data.signals.length === 0 ? (
        <EmptyState title="No signals match">Signals open when a frozen control chart's rule is broken on ingest.</EmptyState>
      ) : (
        <table className="w-full text-left text-sm">
          <thead className="border-b border-paper-300 text-graphite-500">
            <tr><th className="py-2">Signal</th><th>Status</th><th>Product</th><th>Characteristic</th><th>Lot</th><th>Rule</th><th>Opened</th><th>Assigned to</th></tr>
          </thead>
          <tbody>
            {data.signals.map((s) => (
              <tr key={s.id} className="border-b border-paper-200">
                <td className="py-2"><Link className="font-medium text-copper-700 underline" to={paths.signal.href(String(s.id))}>Signal {s.id}</Link></td>
                <td>{statusNames[s.status]}</td><td>{s.product}</td><td>{s.characteristicName}</td><td>{s.lot}</td>
                <td title={s.ruleText}>{s.rule}</td><td className="figures">{s.openedAt.slice(0, 16).replace('T', ' ')}</td><td>{s.assignee?.name ?? '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
