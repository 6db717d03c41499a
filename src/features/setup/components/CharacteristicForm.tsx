import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { characteristicCreateSchema, subgroupModes } from '../../../../server/schemas/setup';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCreateCharacteristic } from '../api/create-characteristic';
import type { Characteristic } from '../api/setup-schemas';
import { useUpdateCharacteristic } from '../api/update-characteristic';
import { Field, inputClass, numberOrNull } from './form-parts';

type Values = z.input<typeof characteristicCreateSchema>;
type CharacteristicFormProps = { productCode: string; characteristic?: Characteristic; onDone: () => void };

const blank: Values = { code: '', name: '', unit: '', testStep: '', spcEnabled: false, subgroupMode: 'individual', subgroupSize: null, sortOrder: 0 };

export function CharacteristicForm({ productCode, characteristic, onDone }: CharacteristicFormProps) {
  const creating = !characteristic;
  const create = useCreateCharacteristic(productCode);
  const update = useUpdateCharacteristic(productCode);
  const mutation = creating ? create : update;
  const { register, handleSubmit, formState: { errors } } = useForm<Values, unknown, z.output<typeof characteristicCreateSchema>>({
    resolver: zodResolver(characteristicCreateSchema),
    defaultValues: characteristic ? { ...characteristic, reason: '' } : blank,
  });
  const onSubmit = handleSubmit(async (values) => {
    const { code, ...input } = values;
    if (creating) await create.mutateAsync(values);
    else await update.mutateAsync({ code, input });
    onDone();
  });
  const id = (name: string) => `characteristic-${characteristic?.code ?? 'new'}-${name}`;

  return (
    <form onSubmit={onSubmit} aria-label={creating ? 'New characteristic' : `Edit characteristic ${characteristic.code}`}
      className="grid grid-cols-2 gap-3 rounded-md bg-paper-100 p-3 md:grid-cols-4">
      <Field id={id('code')} label="Code" error={errors.code}>
        <input id={id('code')} className={`${inputClass} figures`} disabled={!creating} aria-invalid={Boolean(errors.code)} {...register('code')} />
      </Field>
      <Field id={id('name')} label="Name" error={errors.name} className="md:col-span-2">
        <input id={id('name')} className={inputClass} aria-invalid={Boolean(errors.name)} {...register('name')} />
      </Field>
      <Field id={id('unit')} label="Unit" error={errors.unit}>
        <input id={id('unit')} className={inputClass} aria-invalid={Boolean(errors.unit)} {...register('unit')} />
      </Field>
      <Field id={id('step')} label="Test step" error={errors.testStep}>
        <input id={id('step')} className={inputClass} aria-invalid={Boolean(errors.testStep)} {...register('testStep')} />
      </Field>
      <Field id={id('mode')} label="Subgroups" error={errors.subgroupMode}>
        <select id={id('mode')} className={inputClass} {...register('subgroupMode')}>
          {subgroupModes.map((mode) => <option key={mode} value={mode}>{mode}</option>)}
        </select>
      </Field>
      <Field id={id('size')} label="Subgroup size" error={errors.subgroupSize}>
        <input id={id('size')} inputMode="numeric" className={`${inputClass} figures`} aria-invalid={Boolean(errors.subgroupSize)} {...register('subgroupSize', { setValueAs: numberOrNull })} />
      </Field>
      <Field id={id('order')} label="Order" error={errors.sortOrder}>
        <input id={id('order')} inputMode="numeric" className={`${inputClass} figures`} {...register('sortOrder', { setValueAs: (v) => numberOrNull(v) ?? 0 })} />
      </Field>
      <label className="flex items-center gap-2 text-sm text-graphite-800">
        <input type="checkbox" className="h-4 w-4" {...register('spcEnabled')} /> SPC watches it
      </label>
      <Field id={id('reason')} label="Reason" error={errors.reason} className="col-span-2 md:col-span-3">
        <input id={id('reason')} className={inputClass} {...register('reason')} />
      </Field>
      <div className="col-span-2 flex gap-2 md:col-span-4">
        <Button type="submit" size="sm" disabled={mutation.isPending}>{creating ? 'Add characteristic' : 'Save characteristic'}</Button>
        <Button size="sm" variant="quiet" onClick={onDone}>Cancel</Button>
      </div>
      {mutation.error ? <div className="col-span-2 md:col-span-4"><ErrorNote error={mutation.error} title="The characteristic was not saved" /></div> : null}
    </form>
  );
}
