import type { TestRun } from '../api/motor-schemas';
import {
  backEmfSummarySchema, hipotReadingSchema, insulationReadingSchema, readingOf, windingResistanceReadingSchema,
} from '../api/raw-data-schemas';
import { BackEmfPanel } from './BackEmfPanel';
import { HighVoltageReadings } from './HighVoltageReadings';
import { ResolverOffsetPanel } from './ResolverOffsetPanel';
import { WindingResistancePanel } from './WindingResistancePanel';

/**
 * What a run's raw data shows beyond its results table: the back-EMF spin (traces, spectrum and
 * figures), the resolver offset, insulation and hipot with the high-voltage caution, and the
 * phase resistances. Each part appears only when the stand sent that raw data.
 */
export function WaveformPanel({ serial, run }: { serial: string; run: TestRun }) {
  const backEmf = run.waveforms.find((w) => w.kind === 'back-emf');
  const summary = backEmf ? backEmfSummarySchema.safeParse(backEmf.summary) : undefined;
  const insulation = readingOf(run.readings, 'insulation', insulationReadingSchema);
  const hipot = readingOf(run.readings, 'hipot', hipotReadingSchema);
  const windings = readingOf(run.readings, 'winding-resistance', windingResistanceReadingSchema);
  if (!summary?.success && !insulation && !hipot && !windings) return null;
  return (
    <section aria-label="Waveforms and raw readings" className="space-y-5 rounded-md border border-paper-200 bg-paper-50 p-4">
      <h4 className="text-sm font-semibold uppercase tracking-wider text-graphite-600">Waveforms and raw readings</h4>
      {summary?.success ? <BackEmfPanel serial={serial} runId={run.runId} summary={summary.data} results={run.results} /> : null}
      {summary?.success && summary.data.resolver ? <ResolverOffsetPanel resolver={summary.data.resolver} results={run.results} /> : null}
      {windings ? <WindingResistancePanel reading={windings} results={run.results} /> : null}
      <HighVoltageReadings insulation={insulation} hipot={hipot} results={run.results} />
    </section>
  );
}
