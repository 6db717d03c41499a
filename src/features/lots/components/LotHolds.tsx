import { useState } from 'react';
import { Button } from '../../../components/Button';
import { StatusShape } from '../../../components/StatusShape';
import { formatDateTime } from '../../../lib/format';
import type { LotHold } from '../api/lot-schemas';
import { useReleaseHold } from '../api/release-hold';
import { ReasonDialog } from './ReasonDialog';

type LotHoldsProps = {
  lotCode: string;
  holds: LotHold[];
  canRelease: boolean;
};

/** The lot's holds, active first; quality may release an active one, giving a reason. */
export function LotHolds({ lotCode, holds, canRelease }: LotHoldsProps) {
  const [releasing, setReleasing] = useState<LotHold>();
  const release = useReleaseHold();
  const active = holds.filter((hold) => !hold.releasedAt);
  const released = holds.filter((hold) => hold.releasedAt);

  const close = () => {
    setReleasing(undefined);
    release.reset();
  };

  if (holds.length === 0) return <p className="text-sm text-graphite-500">This lot has never been held.</p>;
  return (
    <>
      <ul className="space-y-2">
        {[...active, ...released].map((hold) => {
          const isActive = !hold.releasedAt;
          return (
            <li
              key={hold.id}
              className={`flex flex-wrap items-start gap-3 rounded-md border px-4 py-3 text-sm ${isActive ? 'border-hold bg-hold-soft' : 'border-paper-300 bg-white text-graphite-600'}`}
            >
              <StatusShape kind={isActive ? 'hold' : 'none'} className={`mt-0.5 h-4 w-4 ${isActive ? 'text-hold' : 'text-graphite-400'}`} />
              <div className="min-w-0 flex-1">
                <p className="font-semibold text-graphite-950">
                  {isActive ? 'Active hold' : 'Released hold'} <span className="font-normal text-graphite-500">· {hold.kind}</span>
                </p>
                <p className="mt-0.5 text-graphite-900">{hold.reason}</p>
                <p className="mt-1 text-xs text-graphite-500">
                  Placed by {hold.placedBy}, <span className="figures">{formatDateTime(hold.placedAt)}</span>
                  {hold.releasedAt
                    ? ` · released by ${hold.releasedBy ?? '—'}, ${formatDateTime(hold.releasedAt)}${hold.releaseReason ? `: ${hold.releaseReason}` : ''}`
                    : ''}
                </p>
              </div>
              {isActive && canRelease ? (
                <Button variant="secondary" onClick={() => setReleasing(hold)}>
                  Release hold
                </Button>
              ) : null}
            </li>
          );
        })}
      </ul>
      <ReasonDialog
        open={releasing !== undefined}
        title={`Release the hold on lot ${lotCode}`}
        hint="Why the motors may move again: the investigation and its outcome."
        submitLabel="Release hold"
        pending={release.isPending}
        error={release.error}
        onSubmit={(reason) => releasing && release.mutate({ holdId: releasing.id, reason, lotCode }, { onSuccess: close })}
        onClose={close}
      />
    </>
  );
}
