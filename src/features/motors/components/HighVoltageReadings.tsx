import { z } from 'zod';
import { HighVoltageCaution } from '../../../components/HighVoltageCaution';
import { formatNumber } from '../../../lib/format';
import type { Measurement } from '../api/motor-schemas';
import { hipotReadingSchema, insulationReadingSchema } from '../api/raw-data-schemas';
import { PanelHeading, RawDataFigure, resultFor } from './RawDataFigure';

type HighVoltageReadingsProps = {
  insulation?: z.infer<typeof insulationReadingSchema>;
  hipot?: z.infer<typeof hipotReadingSchema>;
  results: readonly Measurement[];
};

/**
 * Insulation resistance as read and at 40 °C, PI/DAR, and the hipot record, with the
 * high-voltage caution beside them: Fluxtrail shows and judges these results, it runs no test.
 */
export function HighVoltageReadings({ insulation, hipot, results }: HighVoltageReadingsProps) {
  if (!insulation && !hipot) return null;
  const context = [
    insulation ? `insulation ${formatNumber(insulation.testVoltageV, { unit: 'V' })} DC` : null,
    hipot ? `hipot ${formatNumber(hipot.voltageV, { unit: 'V' })} ${hipot.acOrDc.toUpperCase()}` : null,
  ].filter(Boolean).join(', ');
  return (
    <section aria-label="Insulation and hipot" className="space-y-3">
      <HighVoltageCaution context={context} />
      {insulation ? (
        <div className="space-y-2">
          <PanelHeading>Insulation resistance, winding to frame (IEEE 43)</PanelHeading>
          <dl className="grid grid-cols-2 gap-x-6 gap-y-3 text-sm md:grid-cols-4 xl:grid-cols-6">
            <RawDataFigure label="As read (1 min)">
              {formatNumber(insulation.resistanceMegohm, { unit: 'MΩ' })} at {formatNumber(insulation.windingTempC, { maxDigits: 1, unit: '°C' })}
            </RawDataFigure>
            <RawDataFigure label="At 40 °C" result={resultFor(results, 'ir_40c')}>
              {formatNumber(resultFor(results, 'ir_40c')?.value, { unit: 'MΩ' })}
            </RawDataFigure>
            <RawDataFigure label="Test voltage">{formatNumber(insulation.testVoltageV, { unit: 'V DC' })}</RawDataFigure>
            <RawDataFigure label="DAR (60 s / 30 s)" result={resultFor(results, 'dar')}>
              {formatNumber(resultFor(results, 'dar')?.value, { digits: 2 })}
            </RawDataFigure>
            {resultFor(results, 'pi') ? (
              <RawDataFigure label="PI (10 min / 1 min)" result={resultFor(results, 'pi')}>
                {formatNumber(resultFor(results, 'pi')?.value, { digits: 2 })}
              </RawDataFigure>
            ) : null}
          </dl>
        </div>
      ) : null}
      {hipot ? (
        <div className="space-y-2">
          <PanelHeading>Hipot, winding to frame</PanelHeading>
          <dl className="grid grid-cols-2 gap-x-6 gap-y-3 text-sm md:grid-cols-4 xl:grid-cols-6">
            <RawDataFigure label="Voltage" result={resultFor(results, 'hipot_voltage')}>
              {formatNumber(hipot.voltageV, { unit: hipot.acOrDc === 'ac' ? 'V AC RMS' : 'V DC' })}
            </RawDataFigure>
            <RawDataFigure label="Leakage" result={resultFor(results, 'hipot_leakage')}>
              {formatNumber(hipot.leakageMa, { digits: 2, unit: 'mA' })}
            </RawDataFigure>
            <RawDataFigure label="Duration">{formatNumber(hipot.durationS, { unit: 's' })}</RawDataFigure>
          </dl>
        </div>
      ) : null}
    </section>
  );
}
