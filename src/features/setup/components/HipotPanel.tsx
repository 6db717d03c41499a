import { ErrorNote } from '../../../components/ErrorNote';
import { HighVoltageCaution } from '../../../components/HighVoltageCaution';
import { Spinner } from '../../../components/Spinner';
import { formatNumber } from '../../../lib/format';
import { useProductHipot } from '../api/get-product-hipot';

/** The withstand voltage the standard gives for the product's rating, always beside the caution. */
export function HipotPanel({ productCode }: { productCode: string }) {
  const hipot = useProductHipot(productCode);
  if (hipot.isPending) return <Spinner label="Looking up the hipot voltage…" />;
  if (hipot.isError) return <ErrorNote error={hipot.error} title="No standard hipot voltage" />;
  const { acVrms, durationS, source, production, ratedVoltageV, ratedPowerKw } = hipot.data;
  return (
    <div className="space-y-3">
      <HighVoltageCaution context={`hipot ${formatNumber(acVrms, { maxDigits: 0, unit: 'V' })} AC for ${durationS} s`} />
      <dl className="grid gap-3 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-xs uppercase tracking-wide text-graphite-500">Type test (winding to frame)</dt>
          <dd className="figures whitespace-nowrap text-lg text-graphite-900">{formatNumber(acVrms, { maxDigits: 0, unit: 'V' })} AC · {durationS} s</dd>
          <dd className="text-xs text-graphite-500">{source}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase tracking-wide text-graphite-500">Shortened routine test</dt>
          <dd className="figures whitespace-nowrap text-lg text-graphite-900">{formatNumber(production.acVrms, { maxDigits: 0, unit: 'V' })} AC · {production.durationS} s</dd>
          <dd className="text-xs text-graphite-500">{production.source}</dd>
        </div>
        <div className="sm:col-span-2">
          <dt className="text-xs uppercase tracking-wide text-graphite-500">From the rating</dt>
          <dd className="figures text-graphite-900">{formatNumber(ratedVoltageV, { unit: 'V' })} · {formatNumber(ratedPowerKw, { unit: 'kW' })}</dd>
        </div>
      </dl>
      <p className="text-xs text-graphite-500">
        Fluxtrail shows the standard's figure and judges the results stations send; it does not set or drive the test equipment.
      </p>
    </div>
  );
}
