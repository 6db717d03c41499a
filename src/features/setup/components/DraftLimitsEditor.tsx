import { useForm } from 'react-hook-form';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useSaveDraftLimits } from '../api/save-draft-limits';
import type { Characteristic, LimitSetView } from '../api/setup-schemas';
import { draftLimitsResolver, type EditorValues } from './draft-limits-resolver';
import { inputClass, numberOrNull, SavedNote } from './form-parts';

type DraftLimitsEditorProps = { productCode: string; draft: LimitSetView; characteristics: Characteristic[] };
const bounds = [['lsl', 'LSL'], ['nominal', 'Nominal'], ['usl', 'USL']] as const;

/** One row per characteristic; leave all three empty for "no limit". One-sided limits are fine. */
export function DraftLimitsEditor({ productCode, draft, characteristics }: DraftLimitsEditorProps) {
  const save = useSaveDraftLimits(productCode, draft.id);
  const { register, handleSubmit, reset, getValues, formState: { errors, isDirty } } = useForm<EditorValues, unknown, Parameters<typeof save.mutateAsync>[0]>({
    resolver: draftLimitsResolver,
    defaultValues: {
      note: draft.note ?? '',
      rows: characteristics.map((c) => {
        const limit = draft.limits.find((l) => l.characteristicCode === c.code);
        return { characteristicCode: c.code, lsl: limit?.lsl ?? null, nominal: limit?.nominal ?? null, usl: limit?.usl ?? null };
      }),
    },
  });
  // Resetting to what was saved makes "Draft saved." disappear again at the next keystroke.
  const onSubmit = handleSubmit(async (input) => {
    await save.mutateAsync(input);
    reset(getValues());
  });

  return (
    <form onSubmit={onSubmit} aria-label={`Limits of draft revision ${draft.revision}`} className="space-y-3">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Draft revision {draft.revision}: limits per characteristic</caption>
        <thead className="border-b border-paper-300 text-xs uppercase tracking-wide text-graphite-500">
          <tr><th className="py-2">Characteristic</th><th>Unit</th>{bounds.map(([, label]) => <th key={label} className="w-36">{label}</th>)}</tr>
        </thead>
        <tbody>
          {characteristics.map((c, i) => (
            <tr key={c.code} className="border-b border-paper-200 align-top">
              <td className="py-2"><span className="figures">{c.code}</span><span className="block text-xs text-graphite-500">{c.name}</span></td>
              <td className="py-2">{c.unit}</td>
              {bounds.map(([key, label]) => {
                const error = errors.rows?.[i]?.[key];
                return (
                  <td key={key} className="py-1 pr-2">
                    <input aria-label={`${label} for ${c.code}`} inputMode="decimal" aria-invalid={Boolean(error)}
                      className={`${inputClass} figures`} {...register(`rows.${i}.${key}`, { setValueAs: numberOrNull })} />
                    {error?.message ? <p className="text-xs font-medium text-fail-ink">{error.message}</p> : null}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      <label className="block text-sm">
        <span className="text-xs font-medium uppercase tracking-wide text-graphite-600">Note for the reviewer</span>
        <input className={`${inputClass} mt-1`} {...register('note')} />
      </label>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={save.isPending}>Save draft</Button>
        <SavedNote show={save.isSuccess && !isDirty}>Draft saved.</SavedNote>
      </div>
      {save.error ? <ErrorNote error={save.error} title="The draft was not saved" /> : null}
    </form>
  );
}
