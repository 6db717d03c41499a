import type { ReactNode } from 'react';
import { VerdictBadge } from '../../../components/VerdictBadge';
import type { Measurement } from '../api/motor-schemas';
import { formatLimits } from './limits';

/** One labelled figure of a raw-data panel, with the verdict and limits of its result when judged. */
export function RawDataFigure({ label, children, result }: { label: string; children: ReactNode; result?: Measurement }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs uppercase tracking-wider text-graphite-500">{label}</dt>
      <dd className="mt-0.5 flex flex-wrap items-center gap-2 text-graphite-950">
        <span className="figures">{children}</span>
        {result ? <VerdictBadge verdict={result.verdict} size="sm" /> : null}
      </dd>
      {result ? <dd className="figures text-xs text-graphite-500">limit {formatLimits(result)}</dd> : null}
    </div>
  );
}

/** The judged result of one characteristic code in a run, if the run has it. */
export const resultFor = (results: readonly Measurement[], code: string): Measurement | undefined =>
  results.find((r) => r.characteristic === code);

export function PanelHeading({ children }: { children: ReactNode }) {
  return <h5 className="text-sm font-semibold text-graphite-800">{children}</h5>;
}
