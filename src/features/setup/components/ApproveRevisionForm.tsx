import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useApproveLimitSet } from '../api/approve-limit-set';
import type { LimitSetView } from '../api/setup-schemas';
import { Field, inputClass } from './form-parts';

/** The browser's datetime-local field has no zone; it is read as local time and sent as ISO UTC. */
const approveFormSchema = z.object({
  effectiveFrom: z.string().min(1, 'Required').refine((value) => !Number.isNaN(new Date(value).getTime()), 'Not a date and time'),
  reason: z.string().trim().max(1000).optional(),
});
type Values = z.infer<typeof approveFormSchema>;

function localNow(): string {
  const now = new Date(Date.now() + 60_000);
  return new Date(now.getTime() - now.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
}

type ApproveRevisionFormProps = { productCode: string; draft: LimitSetView; onApproved: () => void };

export function ApproveRevisionForm({ productCode, draft, onApproved }: ApproveRevisionFormProps) {
  const approve = useApproveLimitSet(productCode, draft.id);
  const { register, handleSubmit, formState: { errors } } = useForm<Values>({
    resolver: zodResolver(approveFormSchema),
    defaultValues: { effectiveFrom: localNow(), reason: '' },
  });
  const onSubmit = handleSubmit(async (values) => {
    await approve.mutateAsync({ effectiveFrom: new Date(values.effectiveFrom).toISOString(), reason: values.reason });
    onApproved();
  });

  return (
    <form onSubmit={onSubmit} aria-label={`Approve revision ${draft.revision}`} className="space-y-3 rounded-md border border-copper-200 bg-copper-50 p-3">
      <p className="text-sm text-graphite-800">
        Written by <strong>{draft.authoredByName}</strong>. Your approval is the second signature; earlier revisions stay
        in force for runs started before the time below.
      </p>
      <div className="grid gap-3 md:grid-cols-3">
        <Field id="approve-effective-from" label="Effective from" error={errors.effectiveFrom}>
          <input id="approve-effective-from" type="datetime-local" className={`${inputClass} figures`} {...register('effectiveFrom')} />
        </Field>
        <Field id="approve-reason" label="Reason" error={errors.reason} className="md:col-span-2">
          <input id="approve-reason" className={inputClass} {...register('reason')} />
        </Field>
      </div>
      <Button type="submit" disabled={approve.isPending}>Approve revision {draft.revision}</Button>
      {approve.error ? <ErrorNote error={approve.error} title="The revision was not approved" /> : null}
    </form>
  );
}
