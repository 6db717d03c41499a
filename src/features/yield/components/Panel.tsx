import type { ReactNode } from 'react';

type PanelProps = {
  title: string;
  /** The definition of what the panel counts, shown when the title is hovered. */
  definition: string;
  hint?: ReactNode;
  children: ReactNode;
  className?: string;
};

export function Panel({ title, definition, hint, children, className = '' }: PanelProps) {
  return (
    <section className={`rounded-lg border border-paper-300 bg-white p-4 ${className}`} aria-label={title}>
      <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="cursor-help text-sm font-semibold text-graphite-900 underline decoration-dotted decoration-graphite-300 underline-offset-4" title={definition}>
          {title}
        </h2>
        {hint ? <p className="text-xs text-graphite-500">{hint}</p> : null}
      </header>
      {children}
    </section>
  );
}
