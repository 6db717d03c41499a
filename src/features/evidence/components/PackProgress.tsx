import { formatCount, formatPercent } from '../../../lib/format';
import type { EvidencePack } from '../api/pack-schemas';

/** Time left, extrapolated from the rate so far; shown only once there is a rate to go on. */
function timeLeft(pack: EvidencePack, now: number): string | null {
  if (!pack.startedAt || pack.progress <= 0.02 || pack.progress >= 1) return null;
  const elapsedS = (now - new Date(pack.startedAt).getTime()) / 1000;
  const leftS = Math.max(0, Math.round(elapsedS / pack.progress - elapsedS));
  return leftS < 60 ? `about ${leftS} s left` : `about ${Math.round(leftS / 60)} min left`;
}

export function PackProgress({ pack }: { pack: EvidencePack }) {
  const eta = timeLeft(pack, Date.now());
  return (
    <div data-testid="pack-progress" className="min-w-48">
      <progress className="h-2 w-full accent-copper-600" max={1} value={pack.progress} aria-label={`Pack ${pack.id} progress`} />
      <p className="figures text-xs text-graphite-500">
        {formatPercent(pack.progress, 0)} · {formatCount(pack.rows)}{pack.rowsTotal !== null ? ` of ${formatCount(pack.rowsTotal)}` : ''} rows
        {eta ? ` · ${eta}` : ''}
      </p>
    </div>
  );
}
