type SpinnerProps = {
  /** Read out by screen readers and shown next to the spinner. */
  label?: string;
  size?: 'sm' | 'lg';
};

export function Spinner({ label = 'Loading…', size = 'sm' }: SpinnerProps) {
  const dimension = size === 'lg' ? 'h-8 w-8 border-[3px]' : 'h-4 w-4 border-2';
  return (
    <span role="status" className="inline-flex items-center gap-2 text-sm text-graphite-500">
      <span
        aria-hidden="true"
        className={`${dimension} animate-spin rounded-full border-graphite-200 border-t-copper-500`}
      />
      <span>{label}</span>
    </span>
  );
}

/** Centred spinner for a whole screen or panel while its data loads. */
export function LoadingScreen({ label }: { label?: string }) {
  return (
    <div className="flex min-h-48 items-center justify-center p-8">
      <Spinner label={label} size="lg" />
    </div>
  );
}
