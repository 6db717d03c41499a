import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { stationCreateSchema } from '../../../../server/schemas/setup';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCreateStation } from '../api/create-station';
import type { Station } from '../api/setup-schemas';
import { useUpdateStation } from '../api/update-station';
import { ExpiredDueNote } from './ExpiredDueNote';
import { Field, inputClass } from './form-parts';

type Values = z.input<typeof stationCreateSchema>;

const blank: Values = { code: '', name: '', line: '', kind: 'eol-pmsm', active: true, calibrationDue: '', reason: '' };

type StationFormProps = { station?: Station; onDone: () => void };

/**
 * Creates a station, or edits one (its code is fixed once runs carry it). Validated with the
 * server's own schema; moving the due date of an existing station asks for a reason, which the
 * server insists on, since no calibration certificate explains that move.
 */
export function StationForm({ station, onDone }: StationFormProps) {
  const creating = !station;
  const create = useCreateStation();
  const update = useUpdateStation(station?.code ?? '');
  const mutation = creating ? create : update;
  const { register, handleSubmit, watch, formState: { errors } } = useForm<Values, unknown, z.output<typeof stationCreateSchema>>({
    resolver: zodResolver(stationCreateSchema),
    defaultValues: station ? { ...station, reason: '' } : blank,
  });
  const due = watch('calibrationDue');
  const dueMoved = !creating && due !== station.calibrationDue;
  const onSubmit = handleSubmit(async (values) => {
    const { code: _code, ...fields } = values;
    if (creating) await create.mutateAsync(values);
    else await update.mutateAsync(fields);
    onDone();
  });

  const id = (name: string) => `station-${station?.code ?? 'new'}-${name}`;
  return (
    <form onSubmit={onSubmit} aria-label={creating ? 'New station' : `Edit station ${station.code}`} className="grid grid-cols-2 gap-3 rounded-md bg-paper-100 p-3 md:grid-cols-6">
      <Field id={id('code')} label="Code" error={errors.code}>
        <input id={id('code')} readOnly={!creating} className={`${inputClass} figures read-only:bg-paper-200`} aria-invalid={Boolean(errors.code)} {...register('code')} />
      </Field>
      <Field id={id('name')} label="Name" error={errors.name} className="md:col-span-2">
        <input id={id('name')} className={inputClass} aria-invalid={Boolean(errors.name)} {...register('name')} />
      </Field>
      <Field id={id('line')} label="Line" error={errors.line}>
        <input id={id('line')} className={inputClass} aria-invalid={Boolean(errors.line)} {...register('line')} />
      </Field>
      <Field id={id('kind')} label="Kind" error={errors.kind}>
        <input id={id('kind')} className={inputClass} aria-invalid={Boolean(errors.kind)} {...register('kind')} />
      </Field>
      <Field id={id('due')} label="Calibration due" error={errors.calibrationDue}>
        <input id={id('due')} type="date" className={`${inputClass} figures`} aria-invalid={Boolean(errors.calibrationDue)} {...register('calibrationDue')} />
      </Field>
      {creating ? null : (
        <>
          <label className="flex items-center gap-2 text-sm text-graphite-800">
            <input type="checkbox" {...register('active')} /> In use
          </label>
          <Field
            id={id('reason')} label="Reason (for the audit trail)" error={errors.reason} className="col-span-2 md:col-span-5"
            hint={dueMoved ? 'Required: the due date moves without a recorded calibration. To enter a new certificate, record a calibration instead.' : undefined}
          >
            <input id={id('reason')} className={inputClass} aria-invalid={Boolean(errors.reason)} {...register('reason')} />
          </Field>
        </>
      )}
      <ExpiredDueNote due={due} className="col-span-2 md:col-span-6" />
      <div className="col-span-2 flex items-center gap-2 md:col-span-6">
        <Button type="submit" size="sm" disabled={mutation.isPending}>{creating ? 'Create station' : 'Save station'}</Button>
        <Button size="sm" variant="quiet" onClick={onDone}>Cancel</Button>
      </div>
      {mutation.error ? (
        <div className="col-span-2 md:col-span-6"><ErrorNote error={mutation.error} title={creating ? 'The station was not created' : 'The station was not saved'} /></div>
      ) : null}
    </form>
  );
}
