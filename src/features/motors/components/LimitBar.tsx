import type { Measurement } from '../api/motor-schemas';
import { barScale } from './limits';

type LimitBarProps = Pick<Measurement, 'value' | 'lsl' | 'usl' | 'verdict'> & { className?: string };

/**
 * Where the value sits against its limits: the in-limit span is a pale band, each limit a dark tick,
 * the value a copper needle (graphite-ringed red when it failed). Decorative: the row states the numbers.
 */
export function LimitBar({ value, lsl, usl, verdict, className = 'h-4 w-full' }: LimitBarProps) {
  const scale = barScale({ value, lsl, usl });
  if (!scale) return null;
  const bandFrom = scale.lslAt ?? 0;
  const bandTo = scale.uslAt ?? 100;
  const needle = verdict === 'fail' ? 'bg-fail ring-2 ring-graphite-900' : 'bg-copper-600';

  return (
    <div aria-hidden="true" className={`relative ${className}`}>
      <div className="absolute inset-x-0 top-1/2 h-1.5 -translate-y-1/2 rounded-full bg-graphite-200" />
      <div
        className="absolute top-1/2 h-1.5 -translate-y-1/2 bg-paper-50 ring-1 ring-graphite-300"
        style={{ left: `${bandFrom}%`, width: `${bandTo - bandFrom}%` }}
      />
      {[scale.lslAt, scale.uslAt].map((at, index) =>
        at === undefined ? null : (
          <div key={index} className="absolute inset-y-0 w-0.5 -translate-x-1/2 bg-graphite-800" style={{ left: `${at}%` }} />
        ),
      )}
      <div
        className={`absolute top-1/2 h-3/4 w-1.5 -translate-x-1/2 -translate-y-1/2 rounded-sm ${needle}`}
        style={{ left: `${scale.valueAt}%` }}
      />
    </div>
  );
}
