import { Button, ButtonLink } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { formatCount, formatDateTime } from '../../../lib/format';
import { useCancelEvidencePack } from '../api/cancel-evidence-pack';
import { evidencePackDownloadHref } from '../api/download-evidence-pack';
import { useEvidencePacks } from '../api/get-evidence-packs';
import type { EvidencePack, PackFilter } from '../api/pack-schemas';
import { PackProgress } from './PackProgress';

const statusWords: Record<EvidencePack['status'], string> = { queued: '◌ Queued', running: '◐ Building', done: '● Ready', failed: '✕ Failed', cancelled: '− Cancelled' };

function describe(filter: PackFilter): string {
  return [
    filter.serialFrom && `serials ${filter.serialFrom}–${filter.serialTo}`,
    filter.serials && `${formatCount(filter.serials.length)} listed serials`,
    filter.lots && `lots ${filter.lots.join(', ')}`,
    filter.product && `product ${filter.product}`,
    filter.from && `from ${formatDateTime(filter.from)}`,
    filter.to && `before ${formatDateTime(filter.to)}`,
  ].filter(Boolean).join('; ');
}

/** Past and running packs: who asked, for what, how far along, and the SHA-256 of the finished zip. */
export function PackList({ canCreate }: { canCreate: boolean }) {
  const packs = useEvidencePacks();
  const cancel = useCancelEvidencePack();
  if (packs.isPending) return <LoadingScreen label="Loading packs…" />;
  if (packs.isError) return <ErrorNote error={packs.error} title="Could not load the evidence packs" />;
  if (packs.data.items.length === 0) return <EmptyState title="No evidence packs yet">Define one above; it is built in the background.</EmptyState>;
  return (
    <div className="overflow-x-auto rounded-lg border border-paper-300 bg-white">
      <table data-testid="pack-list" className="w-full text-left text-sm">
        <thead className="bg-paper-200 text-xs uppercase tracking-wide text-graphite-600">
          <tr><th className="px-3 py-2">Pack</th><th className="px-3 py-2">Requested</th><th className="px-3 py-2">Covers</th><th className="px-3 py-2">Status</th><th className="px-3 py-2">Size · SHA-256</th><th className="px-3 py-2" /></tr>
        </thead>
        <tbody>
          {packs.data.items.map((pack) => (
            <tr key={pack.id} data-testid="pack-row" data-pack-id={pack.id} data-status={pack.status} className="border-t border-paper-200 align-top">
              <td className="figures px-3 py-2">{pack.id}</td>
              <td className="px-3 py-2">{pack.requestedBy.name} <span className="text-graphite-500">({pack.requestedBy.role})</span><br /><span className="figures text-xs text-graphite-500">{formatDateTime(pack.createdAt)}</span></td>
              <td className="px-3 py-2">{describe(pack.filter)}</td>
              <td className="px-3 py-2">
                <span data-testid="pack-status">{statusWords[pack.status]}</span>
                {pack.status === 'running' || pack.status === 'queued' ? <PackProgress pack={pack} /> : null}
                {pack.error ? <p className="text-xs text-fail-ink">{pack.error}</p> : null}
              </td>
              <td className="figures px-3 py-2 text-xs">
                {pack.sizeBytes !== null ? `${formatCount(pack.sizeBytes)} bytes` : '—'}
                {pack.sha256 ? <code data-testid="pack-sha256" className="block break-all">{pack.sha256}</code> : null}
              </td>
              <td className="whitespace-nowrap px-3 py-2">
                {pack.status === 'done' && canCreate ? <ButtonLink data-testid="pack-download" size="sm" variant="secondary" href={evidencePackDownloadHref(pack.id)} download>Download</ButtonLink> : null}
                {(pack.status === 'queued' || pack.status === 'running') && canCreate ? (
                  <Button data-testid="pack-cancel" size="sm" variant="quiet" disabled={pack.cancelRequested || cancel.isPending} onClick={() => cancel.mutate(pack.id)}>
                    {pack.cancelRequested ? 'Stopping…' : 'Cancel'}
                  </Button>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {cancel.error ? <ErrorNote error={cancel.error} title="Could not cancel the pack" /> : null}
    </div>
  );
}
