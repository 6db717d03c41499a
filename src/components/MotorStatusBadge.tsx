import { StatusShape, type ShapeKind } from './StatusShape';

export type MotorStatus = 'passed' | 'failed' | 'on hold' | 'not tested';

const looks: Record<MotorStatus, { word: string; shape: ShapeKind; tone: string; shapeTone: string }> = {
  passed: { word: 'Passed', shape: 'pass', tone: 'bg-pass-soft text-pass-ink border-pass', shapeTone: 'text-pass' },
  failed: { word: 'Failed', shape: 'fail', tone: 'bg-fail-soft text-fail-ink border-fail', shapeTone: 'text-fail' },
  'on hold': { word: 'On hold', shape: 'hold', tone: 'bg-hold-soft text-hold-ink border-hold', shapeTone: 'text-hold' },
  'not tested': {
    word: 'Not tested',
    shape: 'none',
    tone: 'bg-paper-50 text-graphite-600 border-graphite-300',
    shapeTone: 'text-graphite-400',
  },
};

const sizes = {
  sm: { box: 'h-6 gap-1 px-1.5 text-xs', shape: 'h-3 w-3' },
  md: { box: 'h-8 gap-1.5 px-2.5 text-sm', shape: 'h-4 w-4' },
} as const;

/** A motor's status (passed, failed, on hold, not tested) as a word and a shape, never colour alone. */
export function MotorStatusBadge({ status, size = 'sm' }: { status: MotorStatus; size?: 'sm' | 'md' }) {
  const look = looks[status];
  return (
    <span className={`inline-flex items-center whitespace-nowrap rounded border font-semibold ${sizes[size].box} ${look.tone}`}>
      <StatusShape kind={look.shape} className={`${sizes[size].shape} ${look.shapeTone}`} />
      <span>{look.word}</span>
    </span>
  );
}
