import type { ReactNode } from 'react';

type PageHeaderProps = {
  title: string;
  /** One line under the title: what the screen is for, or the record being shown. */
  description?: ReactNode;
  /** Buttons or links aligned to the right on wide screens. */
  actions?: ReactNode;
};

export function PageHeader({ title, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-paper-300 pb-4">
      <div className="min-w-0">
        <h1 className="text-2xl font-semibold tracking-tight text-graphite-950">{title}</h1>
        {description ? <p className="mt-1 text-sm text-graphite-500">{description}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
    </header>
  );
}
