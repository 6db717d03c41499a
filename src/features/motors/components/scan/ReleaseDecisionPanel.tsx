import { StatusShape, type ShapeKind } from '../../../../components/StatusShape';
import { formatDateTime } from '../../../../lib/format';
import type { Decision, ReleaseDecision } from './release-decision';

const looks: Record<Decision, { word: string; shape: ShapeKind; box: string; shapeTone: string }> = {
  'may ship': { word: 'MAY SHIP', shape: 'pass', box: 'border-pass bg-pass-soft text-pass-ink', shapeTone: 'text-pass' },
  'must not ship': { word: 'MUST NOT SHIP', shape: 'fail', box: 'border-fail bg-fail-soft text-fail-ink', shapeTone: 'text-fail' },
  'on hold': { word: 'ON HOLD', shape: 'hold', box: 'border-hold bg-hold-soft text-hold-ink', shapeTone: 'text-hold' },
  'not tested': {
    word: 'NOT TESTED',
    shape: 'none',
    box: 'border-graphite-400 bg-paper-50 text-graphite-800',
    shapeTone: 'text-graphite-500',
  },
};

type ReleaseDecisionPanelProps = {
  serial: string;
  release: ReleaseDecision;
};

/** The answer to "may this motor ship?", readable at arm's length: word, shape and colour together. */
export function ReleaseDecisionPanel({ serial, release }: ReleaseDecisionPanelProps) {
  const look = looks[release.decision];
  return (
    <section
      aria-label="Release decision"
      data-decision={release.decision}
      className={`rounded-lg border-4 px-6 py-5 ${look.box}`}
    >
      <p className="figures text-xl text-graphite-700">{serial}</p>
      <p className="mt-1 flex items-center gap-4">
        <StatusShape kind={look.shape} className={`h-16 w-16 sm:h-20 sm:w-20 ${look.shapeTone}`} />
        <span role="status" className="text-5xl font-bold tracking-wide sm:text-6xl">
          {look.word}
        </span>
      </p>
      <p className="mt-4 text-2xl font-semibold text-graphite-950">
        <span className="text-graphite-600">Next: </span>
        {release.nextStep}
      </p>
      {release.activeHolds.length > 0 ? (
        <ul aria-label="Active holds" className="mt-4 space-y-2">
          {release.activeHolds.map((hold) => (
            <li key={hold.id} className="rounded-md border border-hold bg-white/70 px-4 py-2 text-lg text-graphite-900">
              <span className="font-semibold">{hold.target.type === 'lot' ? 'Lot hold' : 'Motor hold'}:</span> {hold.reason}
              <span className="block text-sm text-graphite-500">
                placed by {hold.placedBy}, {formatDateTime(hold.placedAt)}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
