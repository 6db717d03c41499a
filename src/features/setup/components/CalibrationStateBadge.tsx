import { StatusShape, type ShapeKind } from '../../../components/StatusShape';
import type { Station } from '../api/setup-schemas';

type State = Station['calibrationState'];
const looks: Record<State, { word: string; shape: ShapeKind; tone: string }> = {
  valid: { word: 'Valid', shape: 'pass', tone: 'border-pass bg-pass-soft text-pass-ink' },
  'due-soon': { word: 'Due soon', shape: 'hold', tone: 'border-hold bg-hold-soft text-hold-ink' },
  expired: { word: 'Expired', shape: 'fail', tone: 'border-fail bg-fail-soft text-fail-ink' },
};

/** Calibration state as a word and a shape, so it reads without colour. */
export function CalibrationStateBadge({ state }: { state: State }) {
  const look = looks[state];
  return (
    <span className={`inline-flex h-6 items-center gap-1 rounded border px-1.5 text-xs font-semibold uppercase tracking-wide ${look.tone}`}>
      <StatusShape kind={look.shape} className="h-3 w-3" />
      {look.word}
    </span>
  );
}
