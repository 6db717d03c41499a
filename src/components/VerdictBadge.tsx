export type Verdict = 'pass' | 'fail' | 'hold';

type VerdictBadgeProps = {
  verdict: Verdict;
  /** `lg` is the Scan screen's answer, readable at arm's length. */
  size?: 'sm' | 'md' | 'lg';
};

const words: Record<Verdict, string> = { pass: 'PASS', fail: 'FAIL', hold: 'HOLD' };

const tones: Record<Verdict, string> = {
  pass: 'bg-pass-soft text-pass-ink border-pass',
  fail: 'bg-fail-soft text-fail-ink border-fail',
  hold: 'bg-hold-soft text-hold-ink border-hold',
};

const shapeTones: Record<Verdict, string> = { pass: 'text-pass', fail: 'text-fail', hold: 'text-hold' };

const sizes = {
  sm: { box: 'h-6 gap-1 px-1.5 text-xs', shape: 'h-3 w-3' },
  md: { box: 'h-8 gap-1.5 px-2.5 text-sm', shape: 'h-4 w-4' },
  lg: { box: 'h-16 gap-3 px-5 text-3xl', shape: 'h-9 w-9' },
} as const;

/** The shapes differ in outline, not only colour: round for pass, crossed bars for fail, a diamond for hold. */
function VerdictShape({ verdict, className }: { verdict: Verdict; className: string }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className={className}>
      {verdict === 'pass' ? <circle cx="8" cy="8" r="6.5" fill="currentColor" /> : null}
      {verdict === 'fail' ? (
        <path d="M3 1 L8 6 L13 1 L15 3 L10 8 L15 13 L13 15 L8 10 L3 15 L1 13 L6 8 L1 3 Z" fill="currentColor" />
      ) : null}
      {verdict === 'hold' ? <path d="M8 0.8 L15.2 8 L8 15.2 L0.8 8 Z" fill="currentColor" /> : null}
    </svg>
  );
}

export function VerdictBadge({ verdict, size = 'md' }: VerdictBadgeProps) {
  const look = sizes[size];
  return (
    <span
      className={`inline-flex items-center rounded border font-semibold tracking-wider ${look.box} ${tones[verdict]}`}
    >
      <VerdictShape verdict={verdict} className={`${look.shape} shrink-0 ${shapeTones[verdict]}`} />
      <span>{words[verdict]}</span>
    </span>
  );
}
