import { StatusShape } from '../../../../components/StatusShape';
import { formatDateTime } from '../../../../lib/format';
import { isActiveHold, type Hold } from '../../api/motor-schemas';

/** The motor's own holds and its lot's, active first; a released hold keeps who released it and why. */
export function HoldList({ holds }: { holds: Hold[] }) {
  if (holds.length === 0) return <p className="text-sm text-graphite-500">No holds, past or present.</p>;
  const ordered = [...holds.filter(isActiveHold), ...holds.filter((hold) => !isActiveHold(hold))];
  return (
    <ul className="space-y-2">
      {ordered.map((hold) => {
        const active = isActiveHold(hold);
        return (
          <li
            key={hold.id}
            className={`flex gap-3 rounded-md border px-4 py-3 text-sm ${active ? 'border-hold bg-hold-soft' : 'border-paper-300 bg-white text-graphite-600'}`}
          >
            <StatusShape kind={active ? 'hold' : 'none'} className={`mt-0.5 h-4 w-4 ${active ? 'text-hold' : 'text-graphite-400'}`} />
            <div className="min-w-0">
              <p className="font-semibold text-graphite-950">
                {active ? 'Active' : 'Released'} {hold.target.type === 'lot' ? 'lot hold' : 'motor hold'}
                <span className="font-normal text-graphite-500"> · {hold.kind}</span>
              </p>
              <p className="mt-0.5 text-graphite-900">{hold.reason}</p>
              <p className="mt-1 text-xs text-graphite-500">
                Placed by {hold.placedBy}, <span className="figures">{formatDateTime(hold.placedAt)}</span>
                {hold.releasedAt ? (
                  <>
                    {' '}· released by {hold.releasedBy ?? '—'}, <span className="figures">{formatDateTime(hold.releasedAt)}</span>
                    {hold.releaseReason ? `: ${hold.releaseReason}` : ''}
                  </>
                ) : null}
              </p>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
