import { formatDateTime } from '../../../lib/format';
import type { LimitSetView } from '../api/setup-schemas';

type RevisionListProps = { limitSets: LimitSetView[]; selectedId: number | undefined; onSelect: (id: number) => void };

const statusMarks: Record<LimitSetView['status'], string> = { draft: '✎', approved: '✓', retired: '⊘' };

function statusWord(limitSet: LimitSetView): string {
  if (limitSet.inForce) return 'in force';
  if (limitSet.status === 'approved' && limitSet.effectiveFrom && new Date(limitSet.effectiveFrom) > new Date()) return 'approved, not yet in force';
  return limitSet.status;
}

/** Revisions newest first; each says its state in words, with a mark, never by colour alone. */
export function RevisionList({ limitSets, selectedId, onSelect }: RevisionListProps) {
  return (
    <ul aria-label="Limit revisions" className="space-y-1">
      {limitSets.map((limitSet) => {
        const selected = limitSet.id === selectedId;
        return (
          <li key={limitSet.id}>
            <button
              type="button"
              aria-pressed={selected}
              onClick={() => onSelect(limitSet.id)}
              className={`w-full rounded-md border px-3 py-2 text-left text-sm ${selected ? 'border-copper-500 bg-copper-50' : 'border-paper-300 bg-white hover:bg-paper-100'}`}
            >
              <span className="flex items-center justify-between gap-2">
                <span className="font-semibold">Revision {limitSet.revision}</span>
                <span className={limitSet.inForce ? 'font-semibold text-pass-ink' : 'text-graphite-600'}>
                  <span aria-hidden="true">{limitSet.inForce ? '●' : statusMarks[limitSet.status]} </span>{statusWord(limitSet)}
                </span>
              </span>
              <span className="block text-xs text-graphite-500">
                by {limitSet.authoredByName}{limitSet.authoredByYou ? ' (you)' : ''}
                {limitSet.approvedByName ? `, approved by ${limitSet.approvedByName}` : ''}
                {limitSet.effectiveFrom ? `, from ${formatDateTime(limitSet.effectiveFrom)}` : ''}
              </span>
            </button>
          </li>
        );
      })}
    </ul>
  );
}
