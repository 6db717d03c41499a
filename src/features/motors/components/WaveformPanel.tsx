import { formatNumber } from '../../../lib/format';
import type { Waveform } from '../api/motor-schemas';

type SummaryRow = { key: string; value: string };

const summaryRows = (summary: unknown): SummaryRow[] => {
  if (summary === null || typeof summary !== 'object' || Array.isArray(summary)) return [];
  return Object.entries(summary).map(([key, value]) => ({
    key,
    value: typeof value === 'number' ? formatNumber(value, { maxDigits: 4 }) : typeof value === 'string' ? value : JSON.stringify(value),
  }));
};

/**
 * The waveforms a run recorded, for now as the server's computed summary per waveform.
 * Slot for the analysis work: the back-EMF chart goes in this component.
 */
export function WaveformPanel({ waveforms }: { waveforms: Waveform[] }) {
  if (waveforms.length === 0) return null;
  return (
    <section aria-label="Waveforms" className="space-y-3">
      <h4 className="text-sm font-semibold uppercase tracking-wider text-graphite-600">Waveforms</h4>
      {waveforms.map((waveform, index) => (
        <table key={`${waveform.kind}-${index}`} className="w-full max-w-xl text-sm">
          <caption className="pb-1 text-left font-medium text-graphite-800">{waveform.kind}</caption>
          <tbody className="divide-y divide-paper-200">
            {summaryRows(waveform.summary).map((row) => (
              <tr key={row.key}>
                <th scope="row" className="py-1 pr-4 text-left font-normal text-graphite-600">
                  {row.key}
                </th>
                <td className="figures py-1 text-right text-graphite-950">{row.value}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ))}
    </section>
  );
}
