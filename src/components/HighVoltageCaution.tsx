type HighVoltageCautionProps = {
  /** Which settings this caution sits next to, e.g. "Hipot 1.8 kV AC, 1 s". */
  context?: string;
};

/**
 * Shown wherever hipot or insulation-resistance test settings appear. Fluxtrail records and
 * judges results; it does not make a test stand safe, so it defers to the site's own rules.
 */
export function HighVoltageCaution({ context }: HighVoltageCautionProps) {
  return (
    <aside
      role="note"
      aria-label="High-voltage caution"
      className="flex gap-3 rounded-md border-l-4 border-hold bg-hold-soft px-4 py-3 text-sm text-hold-ink"
    >
      <svg aria-hidden="true" viewBox="0 0 24 24" className="mt-0.5 h-5 w-5 shrink-0">
        <path d="M12 2 L22.5 20.5 H1.5 Z" fill="currentColor" />
        <path d="M13.2 7 L9.5 13.2 H12 L10.8 18 L14.6 11.6 H12.1 Z" fill="#fcf1d2" />
      </svg>
      <div>
        <p className="font-semibold">High voltage{context ? ` — ${context}` : ''}</p>
        <p className="mt-0.5">
          Hipot and insulation tests apply hazardous voltages. Setting up, running and guarding these tests
          follows your site's electrical-safety procedures, local codes and licensed practice; those take precedence
          over anything shown here. Fluxtrail records and judges results; it does not operate test equipment.
        </p>
      </div>
    </aside>
  );
}
