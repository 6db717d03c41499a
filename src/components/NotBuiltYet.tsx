import type { ReactNode } from 'react';
import { PageHeader } from './PageHeader';

type NotBuiltYetProps = {
  title: string;
  /** The work area that will build this screen, e.g. "SPC". */
  area: string;
  /** The record the URL names, e.g. a serial, so the user sees their link arrived. */
  subject?: ReactNode;
};

/** Placeholder for a screen that later work replaces; it says so plainly and offers nothing that pretends to work. */
export function NotBuiltYet({ title, area, subject }: NotBuiltYetProps) {
  return (
    <section>
      <PageHeader title={title} description={subject} />
      <p className="text-sm text-graphite-500">Not built yet — arrives with {area} work.</p>
    </section>
  );
}
