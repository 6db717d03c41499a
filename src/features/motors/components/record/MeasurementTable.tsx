import { VerdictBadge } from '../../../../components/VerdictBadge';
import { formatNumber } from '../../../../lib/format';
import type { Measurement } from '../../api/motor-schemas';
import { displayUnit } from '../limits';

const numberCell = 'figures px-3 py-1.5 text-right';

/** Every measurement of one run, in test-plan order, with the limits it was judged by. */
export function MeasurementTable({ results }: { results: Measurement[] }) {
  if (results.length === 0) return <p className="text-sm text-graphite-500">This run reported no measurements.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <thead className="text-left text-xs uppercase tracking-wider text-graphite-500">
          <tr>
            <th scope="col" className="px-3 py-1.5 font-medium">Characteristic</th>
            <th scope="col" className="px-3 py-1.5 font-medium">Test step</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Value</th>
            <th scope="col" className="px-3 py-1.5 font-medium">Unit</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">LSL</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Nominal</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">USL</th>
            <th scope="col" className="px-3 py-1.5 font-medium">Verdict</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-200">
          {results.map((result) => (
            <tr key={result.characteristic} className={result.verdict === 'fail' ? 'bg-fail-soft/50' : undefined}>
              <td className="px-3 py-1.5">
                <span className="font-medium text-graphite-950">{result.name}</span>{' '}
                <span className="figures text-xs text-graphite-500">{result.characteristic}</span>
              </td>
              <td className="px-3 py-1.5 text-graphite-600">{result.testStep ?? '—'}</td>
              <td className={`${numberCell} font-semibold text-graphite-950`}>{formatNumber(result.value, { maxDigits: 4 })}</td>
              <td className="px-3 py-1.5 text-graphite-600">{displayUnit(result.unit) ?? ''}</td>
              <td className={numberCell}>{formatNumber(result.lsl, { maxDigits: 4 })}</td>
              <td className={numberCell}>{formatNumber(result.nominal, { maxDigits: 4 })}</td>
              <td className={numberCell}>{formatNumber(result.usl, { maxDigits: 4 })}</td>
              <td className="px-3 py-1.5">
                <VerdictBadge verdict={result.verdict} size="sm" />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
