import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import {
  insulationClasses, motorKinds, productCreateSchema, windingMaterials, windingTypes,
} from '../../../../server/schemas/setup';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCreateProduct } from '../api/create-product';
import type { Product } from '../api/setup-schemas';
import { useUpdateProduct } from '../api/update-product';
import { Field, inputClass, numberOrNull, SavedNote } from './form-parts';

type Values = z.input<typeof productCreateSchema>;

const blank: Values = {
  code: '', name: '', motorKind: 'pmsm', polePairs: 4, resolverPolePairs: 4, ratedVoltageV: 400, ratedPowerKw: 50,
  ratedSpeedRpm: 6000, windingMaterial: 'copper', windingType: 'random', insulationClass: 'H', serialPattern: '^[A-Z]{2}\\d{7}$',
};

type ProductFormProps = { product?: Product; onSaved?: (code: string) => void };

/** Creates a product, or edits one (its code is fixed once serials carry it). */
export function ProductForm({ product, onSaved }: ProductFormProps) {
  const creating = !product;
  const create = useCreateProduct();
  const update = useUpdateProduct(product?.code ?? '');
  const mutation = creating ? create : update;
  const { register, handleSubmit, watch, formState: { errors } } = useForm<Values, unknown, z.output<typeof productCreateSchema>>({
    resolver: zodResolver(productCreateSchema),
    defaultValues: product ? { ...product, reason: '' } : blank,
  });
  const isPmsm = watch('motorKind') === 'pmsm';
  const num = { setValueAs: numberOrNull };

  const onSubmit = handleSubmit(async (values) => {
    const { code, ...fields } = values;
    const saved = creating ? await create.mutateAsync(values) : await update.mutateAsync(fields);
    onSaved?.(saved.code);
  });

  const id = (name: string) => `product-${product?.code ?? 'new'}-${name}`;
  return (
    <form onSubmit={onSubmit} aria-label={creating ? 'New product' : `Edit product ${product.code}`} className="grid grid-cols-2 gap-3 md:grid-cols-4">
      <Field id={id('code')} label="Code" error={errors.code}>
        <input id={id('code')} className={`${inputClass} figures`} disabled={!creating} aria-invalid={Boolean(errors.code)} {...register('code')} />
      </Field>
      <Field id={id('name')} label="Name" error={errors.name} className="col-span-2 md:col-span-3">
        <input id={id('name')} className={inputClass} aria-invalid={Boolean(errors.name)} {...register('name')} />
      </Field>
      <Field id={id('kind')} label="Motor kind" error={errors.motorKind}>
        <select id={id('kind')} className={inputClass} {...register('motorKind')}>
          {motorKinds.map((kind) => <option key={kind} value={kind}>{kind === 'pmsm' ? 'PMSM' : kind === 'dc' ? 'DC' : 'Induction'}</option>)}
        </select>
      </Field>
      <Field id={id('poles')} label="Pole pairs" error={errors.polePairs}>
        <input id={id('poles')} inputMode="numeric" className={`${inputClass} figures`} aria-invalid={Boolean(errors.polePairs)} {...register('polePairs', num)} />
      </Field>
      <Field id={id('resolver')} label="Resolver pole pairs" error={errors.resolverPolePairs} hint={isPmsm ? undefined : 'PMSM only'}>
        <input id={id('resolver')} inputMode="numeric" className={`${inputClass} figures`} aria-invalid={Boolean(errors.resolverPolePairs)} {...register('resolverPolePairs', num)} />
      </Field>
      <Field id={id('insulation')} label="Insulation class" error={errors.insulationClass}>
        <select id={id('insulation')} className={inputClass} {...register('insulationClass')}>
          {insulationClasses.map((c) => <option key={c} value={c}>{c}</option>)}
        </select>
      </Field>
      <Field id={id('voltage')} label="Rated voltage (V)" error={errors.ratedVoltageV}>
        <input id={id('voltage')} inputMode="decimal" className={`${inputClass} figures`} aria-invalid={Boolean(errors.ratedVoltageV)} {...register('ratedVoltageV', num)} />
      </Field>
      <Field id={id('power')} label="Rated power (kW)" error={errors.ratedPowerKw}>
        <input id={id('power')} inputMode="decimal" className={`${inputClass} figures`} aria-invalid={Boolean(errors.ratedPowerKw)} {...register('ratedPowerKw', num)} />
      </Field>
      <Field id={id('speed')} label="Rated speed (rpm)" error={errors.ratedSpeedRpm}>
        <input id={id('speed')} inputMode="decimal" className={`${inputClass} figures`} aria-invalid={Boolean(errors.ratedSpeedRpm)} {...register('ratedSpeedRpm', num)} />
      </Field>
      <Field id={id('material')} label="Winding material" error={errors.windingMaterial}>
        <select id={id('material')} className={inputClass} {...register('windingMaterial')}>
          {windingMaterials.map((m) => <option key={m} value={m}>{m}</option>)}
        </select>
      </Field>
      <Field id={id('winding')} label="Winding type" error={errors.windingType}>
        <select id={id('winding')} className={inputClass} {...register('windingType')}>
          {windingTypes.map((w) => <option key={w} value={w}>{w}-wound</option>)}
        </select>
      </Field>
      <Field id={id('pattern')} label="Serial pattern" error={errors.serialPattern} hint="Anchored regular expression, ^…$" className="col-span-2 md:col-span-3">
        <input id={id('pattern')} className={`${inputClass} figures`} aria-invalid={Boolean(errors.serialPattern)} {...register('serialPattern')} />
      </Field>
      <Field id={id('reason')} label="Reason (for the audit trail)" error={errors.reason} className="col-span-2 md:col-span-4">
        <input id={id('reason')} className={inputClass} {...register('reason')} />
      </Field>
      <div className="col-span-2 flex items-center gap-3 md:col-span-4">
        <Button type="submit" disabled={mutation.isPending}>{creating ? 'Create product' : 'Save product'}</Button>
        <SavedNote show={mutation.isSuccess}>Saved.</SavedNote>
      </div>
      {mutation.error ? <div className="col-span-2 md:col-span-4"><ErrorNote error={mutation.error} title="The product was not saved" /></div> : null}
    </form>
  );
}
