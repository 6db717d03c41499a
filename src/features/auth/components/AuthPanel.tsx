import type { ReactNode } from 'react';
import { Wordmark } from '../../../components/Wordmark';

/** The frame of the signed-out pages: graphite backdrop, one off-white panel in the middle. */
export function AuthPanel({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-graphite-950 p-4">
      <div className="w-full max-w-md rounded-lg bg-paper-100 px-8 py-10 shadow-xl">
        <Wordmark tone="onLight" size="lg" />
        {children}
      </div>
    </main>
  );
}
