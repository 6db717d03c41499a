import type { ReactNode } from 'react';
import type { FieldError } from 'react-hook-form';

export const inputClass =
  'h-9 w-full rounded-md border border-graphite-300 bg-white px-2 text-sm text-graphite-900 ' +
  'disabled:bg-paper-200 disabled:text-graphite-500 aria-[invalid=true]:border-fail';

type FieldProps = {
  id: string;
  label: string;
  error?: FieldError;
  hint?: string;
  children: ReactNode;
  className?: string;
};

/** A labelled control with its validation message tied to it for screen readers. */
export function Field({ id, label, error, hint, children, className = '' }: FieldProps) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-xs font-medium uppercase tracking-wide text-graphite-600">{label}</label>
      {children}
      {hint && !error ? <p className="text-xs text-graphite-500">{hint}</p> : null}
      {error?.message ? <p id={`${id}-error`} className="text-xs font-medium text-fail-ink">{error.message}</p> : null}
    </div>
  );
}

/** Empty text means "not given" (null); anything else is read as a number for zod to judge. */
export const numberOrNull = (value: unknown): number | null =>
  value === '' || value === null || value === undefined ? null : Number(value);

export function SectionCard({ title, children, actions }: { title: string; children: ReactNode; actions?: ReactNode }) {
  return (
    <section aria-label={title} className="rounded-lg border border-paper-300 bg-white p-4">
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-base font-semibold text-graphite-900">{title}</h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

export function SavedNote({ show, children }: { show: boolean; children: ReactNode }) {
  return show ? <p role="status" className="text-sm text-pass-ink">{children}</p> : null;
}
