import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { stationCreateSchema } from '../../../../server/schemas/setup';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCreateStation } from '../api/create-station';
import { Field, inputClass } from './form-parts';

type Values = z.input<typeof stationCreateSchema>;

export function StationForm({ onDone }: { onDone: () => void }) {
  const create = useCreateStation();
  const { register, handleSubmit, formState: { errors } } = useForm<Values, unknown, z.output<typeof stationCreateSchema>>({
    resolver: zodResolver(stationCreateSchema),
    defaultValues: { code: '', name: '', line: '', kind: 'eol-pmsm', active: true, calibrationDue: '' },
  });
  const onSubmit = handleSubmit(async (values) => { await create.mutateAsync(values); onDone(); });
  return (
    <form onSubmit={onSubmit} aria-label="New station" className="grid grid-cols-2 gap-3 rounded-md bg-paper-100 p-3 md:grid-cols-6">
      <Field id="station-code" label="Code" error={errors.code}>
        <input id="station-code" className={`${inputClass} figures`} aria-invalid={Boolean(errors.code)} {...register('code')} />
      </Field>
      <Field id="station-name" label="Name" error={errors.name} className="md:col-span-2">
        <input id="station-name" className={inputClass} aria-invalid={Boolean(errors.name)} {...register('name')} />
      </Field>
      <Field id="station-line" label="Line" error={errors.line}>
        <input id="station-line" className={inputClass} aria-invalid={Boolean(errors.line)} {...register('line')} />
      </Field>
      <Field id="station-kind" label="Kind" error={errors.kind}>
        <input id="station-kind" className={inputClass} aria-invalid={Boolean(errors.kind)} {...register('kind')} />
      </Field>
      <Field id="station-due" label="Calibration due" error={errors.calibrationDue}>
        <input id="station-due" type="date" className={`${inputClass} figures`} aria-invalid={Boolean(errors.calibrationDue)} {...register('calibrationDue')} />
      </Field>
      <div className="col-span-2 flex items-center gap-2 md:col-span-6">
        <Button type="submit" size="sm" disabled={create.isPending}>Create station</Button>
        <Button size="sm" variant="quiet" onClick={onDone}>Cancel</Button>
      </div>
      {create.error ? <div className="col-span-2 md:col-span-6"><ErrorNote error={create.error} title="The station was not created" /></div> : null}
    </form>
  );
}
