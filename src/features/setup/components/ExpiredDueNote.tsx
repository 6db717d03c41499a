import { StatusShape } from '../../../components/StatusShape';
import { formatDate } from '../../../lib/format';

/** Today as the server judges calibration states (its calendar date in UTC). */
export const todayIso = () => new Date().toISOString().slice(0, 10);

/** What an expired due date means for the line, said in words beside the date that caused it. */
export function ExpiredDueNote({ due, className = '' }: { due: string; className?: string }) {
  if (!due || due >= todayIso()) return null;
  return (
    <p role="note" className={`flex items-start gap-2 rounded-md border border-fail bg-fail-soft px-3 py-2 text-sm text-fail-ink ${className}`}>
      <StatusShape kind="fail" className="mt-0.5 h-3.5 w-3.5" />
      <span>
        Calibration expired: due <span className="figures">{formatDate(due)}</span>. Every run on this station is recorded as out of
        calibration and its motor is held until it is retested on a calibrated station.
      </span>
    </p>
  );
}
