import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useRecordReworkNote, type ReworkAction } from '../api/record-rework-note';

const noteFormSchema = z.object({
  note: z.string().trim().min(3, 'Write at least a few words.').max(2000, 'Keep the note under 2,000 characters.'),
});
type NoteForm = z.infer<typeof noteFormSchema>;

const wording: Record<ReworkAction, { title: string; hint: string; submit: string }> = {
  rework: { title: 'Record rework', hint: 'What was found and what was done to the motor.', submit: 'Save rework note' },
  retest: { title: 'Send to retest', hint: 'Why the motor goes back to the test station.', submit: 'Send to retest' },
};

type ReworkDialogProps = {
  serial: string;
  /** Which dialog is open; undefined when closed. */
  action?: ReworkAction;
  onClose: () => void;
};

/** A modal note form; the server records the note and its audit event under the signed-in user. */
export function ReworkDialog({ serial, action, onClose }: ReworkDialogProps) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const mutation = useRecordReworkNote();
  const { register, handleSubmit, reset, formState } = useForm<NoteForm>({
    resolver: zodResolver(noteFormSchema),
    defaultValues: { note: '' },
  });

  useEffect(() => {
    const dialog = dialogRef.current;
    if (!dialog) return;
    if (action && !dialog.open) dialog.showModal();
    if (!action && dialog.open) dialog.close();
  }, [action]);

  const close = () => {
    reset();
    mutation.reset();
    onClose();
  };

  const submit = handleSubmit(({ note }) => {
    if (!action) return;
    mutation.mutate({ serial, action, note }, { onSuccess: close });
  });

  const words = wording[action ?? 'rework'];
  return (
    <dialog
      ref={dialogRef}
      aria-labelledby="rework-dialog-title"
      onClose={close}
      className="m-auto w-[min(36rem,calc(100vw-2rem))] rounded-lg border border-graphite-300 bg-paper-50 p-0 text-graphite-900 backdrop:bg-graphite-950/60"
    >
      <form onSubmit={submit} className="space-y-4 p-6">
        <h2 id="rework-dialog-title" className="text-2xl font-semibold">
          {words.title} <span className="figures text-lg text-graphite-600">{serial}</span>
        </h2>
        <label className="block">
          <span className="text-lg font-medium">Note</span>
          <span className="block text-sm text-graphite-500">{words.hint}</span>
          <textarea
            {...register('note')}
            rows={4}
            aria-invalid={formState.errors.note ? true : undefined}
            className="mt-2 w-full rounded-md border border-graphite-300 bg-white px-3 py-2 text-lg"
          />
        </label>
        {formState.errors.note ? <p className="text-fail-ink">{formState.errors.note.message}</p> : null}
        {mutation.isError ? <ErrorNote error={mutation.error} title="The note was not saved" /> : null}
        <div className="flex flex-wrap justify-end gap-3">
          <Button variant="secondary" size="glove" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" size="glove" disabled={mutation.isPending}>
            {mutation.isPending ? 'Saving…' : words.submit}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
