import { StatusShape, type ShapeKind } from '../../../components/StatusShape';
import { formatCount } from '../../../lib/format';
import type { LotCounts } from '../api/lot-schemas';

const parts: Array<{ key: keyof Omit<LotCounts, 'motors'>; word: string; shape: ShapeKind; tone: string }> = [
  { key: 'passed', word: 'passed', shape: 'pass', tone: 'text-pass' },
  { key: 'failed', word: 'failed', shape: 'fail', tone: 'text-fail' },
  { key: 'onHold', word: 'on hold', shape: 'hold', tone: 'text-hold' },
  { key: 'notTested', word: 'not tested', shape: 'none', tone: 'text-graphite-400' },
];

/** A lot's motors by status: each count with its word and shape. `large` is the lot page's headline. */
export function LotCountsSummary({ counts, large = false }: { counts: LotCounts; large?: boolean }) {
  const text = large ? 'text-lg' : 'text-sm';
  const shape = large ? 'h-4 w-4' : 'h-3 w-3';
  return (
    <ul className={`flex flex-wrap items-center gap-x-4 gap-y-1 ${text}`}>
      <li className="text-graphite-700">
        <span className="figures font-semibold text-graphite-950">{formatCount(counts.motors)}</span> motors
      </li>
      {parts.map((part) => {
        // Zero counts step back so the eye lands on the lots that have failures or holds.
        const none = counts[part.key] === 0;
        return (
          <li key={part.key} className={`inline-flex items-center gap-1.5 ${none ? 'text-graphite-400' : 'text-graphite-700'}`}>
            <StatusShape kind={part.shape} className={`${shape} ${none ? 'text-graphite-300' : part.tone}`} />
            <span className={`figures font-semibold ${none ? '' : 'text-graphite-950'}`}>{formatCount(counts[part.key])}</span> {part.word}
          </li>
        );
      })}
    </ul>
  );
}
