import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { formatNumber } from '../../../lib/format';
import { useWaveform } from '../api/get-waveform';
import type { Measurement } from '../api/motor-schemas';
import type { BackEmfSummary } from '../api/raw-data-schemas';
import { LazyBackEmfChart } from './LazyBackEmfChart';
import { LINE_LABELS, LINES } from './phase-lines';
import { PanelHeading, RawDataFigure, resultFor } from './RawDataFigure';

type BackEmfPanelProps = { serial: string; runId: string; summary: BackEmfSummary; results: readonly Measurement[] };

/** The back-EMF spin: traces and spectrum, Ke, THD per line, unbalance, phase spacing and sequence. */
export function BackEmfPanel({ serial, runId, summary, results }: BackEmfPanelProps) {
  const display = useWaveform({ serial, runId, kind: 'back-emf' });
  const spacing = summary.phaseSpacingDeg;
  return (
    <section aria-label="Back-EMF" className="space-y-3">
      <PanelHeading>Back-EMF, open circuit at {formatNumber(summary.electricalHz, { maxDigits: 2, unit: 'Hz' })}</PanelHeading>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 text-sm md:grid-cols-4 xl:grid-cols-6">
        <RawDataFigure label="Ke (line-to-line RMS)" result={resultFor(results, 'ke')}>
          {formatNumber(summary.keVPerKrpm, { digits: 2, unit: 'V/krpm' })}
        </RawDataFigure>
        <RawDataFigure label="THD per line (IEEE 519)" result={resultFor(results, 'emf_thd')}>
          {LINES.map((line) => `${LINE_LABELS[line]} ${formatNumber(summary.thdPercent[line], { digits: 2 })}`).join(' · ')} %
        </RawDataFigure>
        <RawDataFigure label="Unbalance (NEMA MG 1)" result={resultFor(results, 'emf_unbalance')}>
          {formatNumber(summary.unbalancePercent, { digits: 2, unit: '%' })}
        </RawDataFigure>
        <RawDataFigure label="Phase spacing" result={resultFor(results, 'phase_spacing_dev')}>
          {[spacing.uvToVw, spacing.vwToWu, spacing.wuToUv].map((deg) => formatNumber(deg, { digits: 1 })).join(' / ')}°
        </RawDataFigure>
        <RawDataFigure label="Phase sequence" result={resultFor(results, 'phase_sequence')}>
          {summary.sequence === 'UVW' ? 'U-V-W' : 'U-W-V (reversed)'}
        </RawDataFigure>
        <RawDataFigure label="Pole pairs from frequency">{summary.polePairsFromFrequency}</RawDataFigure>
      </dl>
      {display.isPending ? <Spinner label="Loading the samples…" /> : null}
      {display.isError ? <ErrorNote error={display.error} title="Could not load the waveform samples" /> : null}
      {display.data ? <LazyBackEmfChart display={display.data} /> : null}
    </section>
  );
}
