import { formatDateTime } from '../../../lib/format';
import { useCan } from '../../auth/use-can';
import type { Characteristic, LimitSetView } from '../api/setup-schemas';
import { ApproveRevisionForm } from './ApproveRevisionForm';
import { DraftLimitsEditor } from './DraftLimitsEditor';
import { LimitDifferenceTable } from './LimitDifferenceTable';
import { HighVoltageNote } from './HighVoltageNote';
import { DiscardDraftButton, RetireRevisionForm } from './RevisionLifecycleActions';
import { SectionCard } from './form-parts';

type RevisionDetailProps = { productCode: string; limitSet: LimitSetView; characteristics: Characteristic[]; onApproved: () => void };

/**
 * One revision: its author edits it while it is a draft; another quality user approves it. The
 * buttons follow the server's permissions and authorship flags; the server enforces both anyway.
 */
export function RevisionDetail({ productCode, limitSet, characteristics, onApproved }: RevisionDetailProps) {
  const canAuthor = useCan('limits:author');
  const canApprove = useCan('limits:approve');
  const isDraft = limitSet.status === 'draft';
  const editable = isDraft && canAuthor && limitSet.authoredByYou;

  return (
    <div className="space-y-4">
      <HighVoltageNote characteristics={characteristics} />
      <SectionCard title={`Revision ${limitSet.revision} · ${limitSet.inForce ? 'in force' : limitSet.status}`}
        actions={isDraft && canAuthor ? <DiscardDraftButton productCode={productCode} limitSet={limitSet} /> : null}>
        <p className="mb-3 text-sm text-graphite-600">
          Written by {limitSet.authoredByName} on {formatDateTime(limitSet.authoredAt)}
          {limitSet.approvedByName ? `; approved by ${limitSet.approvedByName} on ${formatDateTime(limitSet.approvedAt)}, in force from ${formatDateTime(limitSet.effectiveFrom)}` : ''}
          {limitSet.retiredAt ? `; retired ${formatDateTime(limitSet.retiredAt)}` : ''}.
          {limitSet.note ? <span className="mt-1 block">Note: {limitSet.note}</span> : null}
        </p>
        {editable ? (
          <DraftLimitsEditor key={limitSet.id} productCode={productCode} draft={limitSet} characteristics={characteristics} />
        ) : isDraft ? (
          <p className="text-sm text-graphite-600">Only {limitSet.authoredByName} edits this draft; review its difference below.</p>
        ) : null}
      </SectionCard>
      <SectionCard title="Difference">
        <LimitDifferenceTable productCode={productCode} limitSetId={limitSet.id} />
      </SectionCard>
      {isDraft && canApprove && !limitSet.authoredByYou ? <ApproveRevisionForm productCode={productCode} draft={limitSet} onApproved={onApproved} /> : null}
      {isDraft && canApprove && limitSet.authoredByYou ? (
        <p className="text-sm text-graphite-600">You wrote this revision, so a second quality user approves it.</p>
      ) : null}
      {limitSet.status === 'approved' && canApprove ? <RetireRevisionForm productCode={productCode} limitSet={limitSet} /> : null}
    </div>
  );
}
