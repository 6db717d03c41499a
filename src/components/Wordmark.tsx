type WordmarkProps = {
  /** `onDark` for the graphite top bar, `onLight` for off-white panels. */
  tone?: 'onDark' | 'onLight';
  size?: 'md' | 'lg';
};

const tones = {
  onDark: { text: 'text-paper-100', mark: 'text-copper-400' },
  onLight: { text: 'text-graphite-950', mark: 'text-copper-600' },
} as const;

const sizes = {
  md: { text: 'text-lg', mark: 'h-4 w-8' },
  lg: { text: 'text-3xl', mark: 'h-6 w-12' },
} as const;

/** Our own mark: a short measured trace running into a point, next to the name. */
export function Wordmark({ tone = 'onDark', size = 'md' }: WordmarkProps) {
  return (
    <span className={`inline-flex items-center gap-2 ${tones[tone].text}`}>
      <svg aria-hidden="true" viewBox="0 0 32 16" className={`${sizes[size].mark} ${tones[tone].mark}`}>
        <path
          d="M1 11 C5 11 6 4 10 4 S15 12 19 12 S24 6 26.5 6"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinecap="round"
        />
        <circle cx="29" cy="6" r="2.4" fill="currentColor" />
      </svg>
      <span className={`${sizes[size].text} font-semibold tracking-tight`}>Fluxtrail</span>
    </span>
  );
}
