import { z } from 'zod';
import { formatNumber } from '../../../lib/format';
import type { Measurement } from '../api/motor-schemas';
import { windingResistanceReadingSchema } from '../api/raw-data-schemas';
import { displayUnit } from './limits';
import { PanelHeading, RawDataFigure, resultFor } from './RawDataFigure';

type WindingResistancePanelProps = { reading: z.infer<typeof windingResistanceReadingSchema>; results: readonly Measurement[] };

// The codes name their reference temperature (r_u_20c: phase U at 20 °C), so the heading can say it.
const PHASE_CODE = /^r_([uvw])_(\d+)c$/;
// Readings come in ohms; the as-read figure uses the unit the product keeps its results in.
const PER_OHM: Record<string, number> = { 'Ω': 1, 'mΩ': 1e3, 'µΩ': 1e6 };

/** Phase resistances as read and at the reference temperature, with their NEMA MG 1 unbalance. */
export function WindingResistancePanel({ reading, results }: WindingResistancePanelProps) {
  const phases = results.flatMap((result) => {
    const match = PHASE_CODE.exec(result.characteristic);
    return match ? [{ phase: match[1].toUpperCase(), referenceC: match[2], result }] : [];
  });
  const referenceC = phases[0]?.referenceC;
  const unit = phases[0] && PER_OHM[phases[0].result.unit ?? ''] ? (phases[0].result.unit as string) : 'Ω';
  return (
    <section aria-label="Winding resistance" className="space-y-2">
      <PanelHeading>Winding resistance{referenceC ? ` at ${referenceC} °C` : ''} (IEC 60034-1)</PanelHeading>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 text-sm md:grid-cols-4 xl:grid-cols-6">
        {phases.map(({ phase, result }) => (
          <RawDataFigure key={phase} label={`Phase ${phase}`} result={result}>
            {formatNumber(result.value, { digits: 3, unit: displayUnit(result.unit) })}
          </RawDataFigure>
        ))}
        <RawDataFigure label="Unbalance (NEMA MG 1)" result={resultFor(results, 'r_unbalance')}>
          {formatNumber(resultFor(results, 'r_unbalance')?.value, { digits: 2, unit: '%' })}
        </RawDataFigure>
        <RawDataFigure label="As read">
          {[reading.uOhm, reading.vOhm, reading.wOhm].map((ohm) => formatNumber(ohm * PER_OHM[unit], { digits: 3 })).join(' / ')} {unit} at{' '}
          {formatNumber(reading.windingTempC, { maxDigits: 1, unit: '°C' })}
        </RawDataFigure>
      </dl>
    </section>
  );
}
