import type { ReactNode } from 'react';

type EmptyStateProps = {
  title: string;
  /** What to do next, in one or two short sentences. */
  children?: ReactNode;
  action?: ReactNode;
};

export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <div className="rounded-lg border border-dashed border-paper-300 bg-paper-50 px-6 py-10 text-center">
      <p className="text-base font-medium text-graphite-800">{title}</p>
      {children ? <div className="mx-auto mt-2 max-w-prose text-sm text-graphite-500">{children}</div> : null}
      {action ? <div className="mt-4 flex justify-center">{action}</div> : null}
    </div>
  );
}
