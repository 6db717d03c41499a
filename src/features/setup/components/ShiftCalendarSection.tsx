import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm } from 'react-hook-form';
import { shiftCalendarBodySchema, type ShiftCalendarBody } from '../../../../server/schemas/shift-calendar';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { useChangeShiftCalendar, useShiftCalendar, type ShiftCalendarView } from '../api/shift-calendar';
import { Field, inputClass } from './form-parts';

/** The plant's shifts, its time zone and the first-pass target the Yield board draws. */
export function ShiftCalendarSection({ canEdit }: { canEdit: boolean }) {
  const calendar = useShiftCalendar();
  if (calendar.isPending) return <Spinner />;
  if (calendar.error) return <ErrorNote error={calendar.error} />;
  return <ShiftCalendarForm calendar={calendar.data} canEdit={canEdit} />;
}

function ShiftCalendarForm({ calendar, canEdit }: { calendar: ShiftCalendarView; canEdit: boolean }) {
  const change = useChangeShiftCalendar();
  const { register, control, handleSubmit, reset, formState: { errors } } = useForm<ShiftCalendarBody>({
    resolver: zodResolver(shiftCalendarBodySchema),
    defaultValues: { ...calendar, reason: '' },
  });
  const shifts = useFieldArray({ control, name: 'shifts' });
  const onSubmit = handleSubmit(async (values) => {
    await change.mutateAsync(values);
    reset({ ...values, reason: '' });
  });

  return (
    <form onSubmit={onSubmit} aria-label="Shift calendar" className="max-w-3xl space-y-4 rounded-md border border-paper-300 bg-white p-4">
      <p className="text-sm text-graphite-700">
        Each motor counts in the production day and shift of its first test. A night shift belongs to the day it starts.
        Changing the calendar refiles the motors already counted; the change is written to the audit trail.
      </p>
      <fieldset disabled={!canEdit} className="space-y-4">
        <div className="grid gap-3 md:grid-cols-2">
          <Field id="calendar-zone" label="Plant time zone" error={errors.timeZone} hint="IANA name, e.g. Europe/Berlin or UTC">
            <input id="calendar-zone" className={inputClass} {...register('timeZone')} />
          </Field>
          <Field id="calendar-target" label="First-pass yield target (0–1)" error={errors.firstPassTarget}>
            <input id="calendar-target" type="number" step="0.001" className={`${inputClass} figures`} {...register('firstPassTarget', { valueAsNumber: true })} />
          </Field>
        </div>
        <table className="w-full text-sm" aria-label="Shifts">
          <thead>
            <tr className="text-left text-xs uppercase tracking-wide text-graphite-600"><th className="py-1">Code</th><th>Name</th><th>Starts at</th><th /></tr>
          </thead>
          <tbody>
            {shifts.fields.map((field, index) => (
              <tr key={field.id}>
                <td className="py-1 pr-2"><input aria-label={`Code of shift ${index + 1}`} className={`${inputClass} figures`} {...register(`shifts.${index}.code`)} /></td>
                <td className="pr-2"><input aria-label={`Name of shift ${index + 1}`} className={inputClass} {...register(`shifts.${index}.name`)} /></td>
                <td className="pr-2"><input aria-label={`Start of shift ${index + 1}`} type="time" className={`${inputClass} figures`} {...register(`shifts.${index}.startsAt`)} /></td>
                <td><Button type="button" variant="quiet" size="sm" onClick={() => shifts.remove(index)}>Remove</Button></td>
              </tr>
            ))}
          </tbody>
        </table>
        {errors.shifts ? <p className="text-xs font-medium text-fail-ink">{errors.shifts.message ?? 'Check the shifts: each needs a code, a name and a start time.'}</p> : null}
        <Button type="button" variant="secondary" size="sm" onClick={() => shifts.append({ code: '', name: '', startsAt: '00:00' })}>Add a shift</Button>
        <Field id="calendar-reason" label="Reason" error={errors.reason}>
          <input id="calendar-reason" className={inputClass} {...register('reason')} />
        </Field>
      </fieldset>
      {canEdit
        ? <Button type="submit" disabled={change.isPending}>Save the shift calendar</Button>
        : <p className="text-sm text-graphite-600">Only an administrator changes the shift calendar.</p>}
      {change.isSuccess ? <p role="status" className="text-sm text-pass-ink">Shift calendar saved.</p> : null}
      {change.error ? <ErrorNote error={change.error} title="The calendar was not saved" /> : null}
    </form>
  );
}
