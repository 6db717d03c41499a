/** Which outline to draw: the same language as VerdictBadge, plus an empty ring for "nothing measured yet". */
export type ShapeKind = 'pass' | 'fail' | 'hold' | 'none';

type StatusShapeProps = {
  kind: ShapeKind;
  className?: string;
};

/** Round for pass, crossed bars for fail, a diamond for hold, a hollow ring for none: readable without colour. */
export function StatusShape({ kind, className = 'h-4 w-4' }: StatusShapeProps) {
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className={`shrink-0 ${className}`}>
      {kind === 'pass' ? <circle cx="8" cy="8" r="6.5" fill="currentColor" /> : null}
      {kind === 'fail' ? (
        <path d="M3 1 L8 6 L13 1 L15 3 L10 8 L15 13 L13 15 L8 10 L3 15 L1 13 L6 8 L1 3 Z" fill="currentColor" />
      ) : null}
      {kind === 'hold' ? <path d="M8 0.8 L15.2 8 L8 15.2 L0.8 8 Z" fill="currentColor" /> : null}
      {kind === 'none' ? <circle cx="8" cy="8" r="5.5" fill="none" stroke="currentColor" strokeWidth="2.5" /> : null}
    </svg>
  );
}
