import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { formatCount } from '../../../lib/format';
import { useVerifyAuditChain, type ChainResult } from '../api/verify-audit-chain';

function verdictText(result: ChainResult): string {
  if (result.ok) return `The audit trail is whole: all ${formatCount(result.checked)} events match their hashes and links.`;
  return `The chain breaks at event ${result.firstBrokenId}: ${result.problem ?? 'it does not match its hash'}. ` +
    `${formatCount(result.checked)} events before it are intact.`;
}

/** "Verify the chain": walks every event on the server, with a progress bar and a plain-words verdict. */
export function ChainVerifier({ onShowEvent }: { onShowEvent: (id: number) => void }) {
  const verify = useVerifyAuditChain();
  const { progress } = verify;
  const ratio = progress && progress.total > 0 ? progress.checked / progress.total : 0;
  return (
    <section className="mb-6 rounded-lg border border-paper-300 bg-white p-4" aria-labelledby="chain-check-title">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="chain-check-title" className="text-base font-semibold text-graphite-900">Chain check</h2>
        <Button data-testid="audit-verify" onClick={() => verify.mutate()} disabled={verify.isPending}>Verify the chain</Button>
      </div>
      {verify.isPending ? (
        <div className="mt-3">
          <progress data-testid="audit-verify-progress" className="h-2 w-full accent-copper-600" max={1} value={ratio} />
          <p className="figures mt-1 text-sm text-graphite-500">{progress ? `${formatCount(progress.checked)} of ${formatCount(progress.total)} events checked` : 'Starting…'}</p>
        </div>
      ) : null}
      {verify.data ? (
        <p data-testid="audit-verify-result" data-ok={verify.data.ok} role="status"
          className={`mt-3 rounded-md px-3 py-2 text-sm ${verify.data.ok ? 'bg-pass-soft text-pass-ink' : 'bg-fail-soft text-fail-ink'}`}>
          <span aria-hidden="true">{verify.data.ok ? '✓ ' : '✕ '}</span>
          {verdictText(verify.data)}
          {verify.data.firstBrokenId !== undefined ? (
            <button type="button" className="ml-2 underline" onClick={() => onShowEvent(verify.data!.firstBrokenId!)}>Show events from there</button>
          ) : null}
        </p>
      ) : null}
      {verify.error ? <div className="mt-3"><ErrorNote error={verify.error} title="Could not verify the chain" /></div> : null}
    </section>
  );
}
