import { useState } from 'react';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useDiscardLimitDraft } from '../api/discard-limit-draft';
import { useRetireLimitSet } from '../api/retire-limit-set';
import type { LimitSetView } from '../api/setup-schemas';
import { inputClass } from './form-parts';

type ActionsProps = { productCode: string; limitSet: LimitSetView };

/** Throwing a draft away: asks once, because the draft's limits are gone afterwards (the audit keeps them). */
export function DiscardDraftButton({ productCode, limitSet }: ActionsProps) {
  const discard = useDiscardLimitDraft(productCode, limitSet.id);
  const [confirming, setConfirming] = useState(false);
  if (!confirming) return <Button variant="secondary" onClick={() => setConfirming(true)}>Discard draft</Button>;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <span className="text-sm text-graphite-800">Discard draft revision {limitSet.revision}?</span>
      <Button variant="danger" disabled={discard.isPending} onClick={() => discard.mutate(undefined)}>Yes, discard revision {limitSet.revision}</Button>
      <Button variant="quiet" onClick={() => setConfirming(false)}>Keep it</Button>
      {discard.error ? <ErrorNote error={discard.error} title="The draft was not discarded" /> : null}
    </div>
  );
}

/** Retiring needs a reason: runs already judged keep the revision; new runs stop using it. */
export function RetireRevisionForm({ productCode, limitSet }: ActionsProps) {
  const retire = useRetireLimitSet(productCode, limitSet.id);
  const [reason, setReason] = useState('');
  return (
    <form
      aria-label={`Retire revision ${limitSet.revision}`}
      className="flex flex-wrap items-end gap-2"
      onSubmit={(event) => { event.preventDefault(); retire.mutate({ reason }); }}
    >
      <label className="flex flex-col gap-1 text-sm">
        <span className="text-xs font-medium uppercase tracking-wide text-graphite-600">Reason to retire</span>
        <input className={`${inputClass} w-80`} value={reason} onChange={(event) => setReason(event.target.value)} />
      </label>
      <Button type="submit" variant="secondary" disabled={retire.isPending || reason.trim().length < 3}>Retire revision {limitSet.revision}</Button>
      {retire.error ? <ErrorNote error={retire.error} title="The revision was not retired" /> : null}
    </form>
  );
}
