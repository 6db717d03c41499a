import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';

const reasonFormSchema = z.object({
  reason: z.string().trim().min(3, 'Say why, in at least 3 characters.').max(1000, 'Keep the reason under 1,000 characters.'),
});
type ReasonForm = z.infer<typeof reasonFormSchema>;

type ReasonDialogProps = {
  open: boolean;
  title: string;
  hint: string;
  submitLabel: string;
  pending: boolean;
  error: unknown;
  onSubmit: (reason: string) => void;
  onClose: () => void;
};

/** A modal asking for the reason that the audit trail will record with the action. */
export function ReasonDialog({ open, title, hint, submitLabel, pending, error, onSubmit, onClose }: ReasonDialogProps) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const { register, handleSubmit, reset, formState } = useForm<ReasonForm>({
    resolver: zodResolver(reasonFormSchema),
    defaultValues: { reason: '' },
  });

  useEffect(() => {
    const dialog = dialogRef.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      reset();
      dialog.showModal();
    }
    if (!open && dialog.open) dialog.close();
  }, [open, reset]);

  return (
    <dialog
      ref={dialogRef}
      aria-label={title}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-graphite-300 bg-paper-50 p-0 text-graphite-900 backdrop:bg-graphite-950/60"
    >
      <form onSubmit={handleSubmit(({ reason }) => onSubmit(reason))} className="space-y-4 p-6">
        <h2 className="text-xl font-semibold">{title}</h2>
        <label className="block">
          <span className="font-medium">Reason</span>
          <span className="block text-sm text-graphite-500">{hint}</span>
          <textarea
            {...register('reason')}
            rows={3}
            aria-invalid={formState.errors.reason ? true : undefined}
            className="mt-2 w-full rounded-md border border-graphite-300 bg-white px-3 py-2"
          />
        </label>
        {formState.errors.reason ? <p className="text-sm text-fail-ink">{formState.errors.reason.message}</p> : null}
        {error ? <ErrorNote error={error} title="Not saved" /> : null}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" disabled={pending}>
            {pending ? 'Saving…' : submitLabel}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
