import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { formatNumber } from '../../../lib/format';
import { useLimitSetDifference } from '../api/get-limit-set-difference';
import type { LimitDifference } from '../api/setup-schemas';

type Bounds = LimitDifference['rows'][number]['before'];

const changeWords: Record<LimitDifference['rows'][number]['change'], string> = {
  added: '+ added', removed: '− removed', changed: '≠ changed', unchanged: '= same',
};

function BoundsCell({ bounds }: { bounds: Bounds }) {
  if (!bounds) return <span className="text-graphite-400">no limit</span>;
  return (
    <span className="figures">
      {formatNumber(bounds.lsl)} · {formatNumber(bounds.nominal)} · {formatNumber(bounds.usl)}
    </span>
  );
}

/** What this revision changes (or, for a draft, would change), characteristic by characteristic. */
export function LimitDifferenceTable({ productCode, limitSetId }: { productCode: string; limitSetId: number }) {
  const difference = useLimitSetDifference(productCode, limitSetId);
  if (difference.isPending) return <Spinner label="Comparing with the revision in force…" />;
  if (difference.isError) return <ErrorNote error={difference.error} title="Could not compare the revisions" />;
  const { rows, comparedWithRevision, revision, changedCount, status } = difference.data;
  const against = comparedWithRevision === null
    ? 'no earlier revision'
    : status === 'draft' ? `revision ${comparedWithRevision}, in force now` : `revision ${comparedWithRevision}, which it followed`;
  return (
    <table className="w-full text-left text-sm">
      <caption className="mb-2 text-left text-sm text-graphite-700">
        Revision {revision} against {against}: {changedCount} {changedCount === 1 ? 'change' : 'changes'}
      </caption>
      <thead className="border-b border-paper-300 text-xs uppercase tracking-wide text-graphite-500">
        <tr><th className="py-2">Characteristic</th><th>Unit</th><th>Before (LSL · nom · USL)</th><th>After (LSL · nom · USL)</th><th>Change</th></tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.characteristicCode} className={`border-b border-paper-200 ${row.change === 'unchanged' ? '' : 'bg-copper-50 font-medium'}`}>
            <td className="figures py-2">{row.characteristicCode}</td>
            <td>{row.unit}</td>
            <td><BoundsCell bounds={row.before} /></td>
            <td><BoundsCell bounds={row.after} /></td>
            <td>{changeWords[row.change]}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
