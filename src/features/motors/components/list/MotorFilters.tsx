import type { ReactNode } from 'react';
import { Button } from '../../../../components/Button';
import type { Product } from '../../api/get-products';
import type { FilterKey } from '../../hooks/use-motor-list-params';
import { DebouncedTextInput } from './DebouncedTextInput';

type MotorFiltersProps = {
  filters: Record<FilterKey, string>;
  products: Product[];
  onChange: (changes: Partial<Record<FilterKey, string>>) => void;
  onClear: () => void;
};

const fieldClass = 'mt-1 h-10 w-full rounded-md border border-graphite-300 bg-white px-3 text-sm text-graphite-900';
const statuses = ['passed', 'failed', 'on hold', 'not tested'] as const;

function Field({ label, children }: { label: string; children: ReactNode }) {
  return (
    <label className="block min-w-0">
      <span className="text-xs font-medium uppercase tracking-wider text-graphite-500">{label}</span>
      {children}
    </label>
  );
}

/** Filters for the Motors list; every value lives in the URL so a filtered list can be shared. */
export function MotorFilters({ filters, products, onChange, onClear }: MotorFiltersProps) {
  const text = (key: FilterKey, label: string, placeholder: string) => (
    <Field label={label}>
      <DebouncedTextInput
        value={filters[key]}
        onCommit={(value) => onChange({ [key]: value.trim() })}
        placeholder={placeholder}
        spellCheck={false}
        autoComplete="off"
        className={`figures ${fieldClass}`}
      />
    </Field>
  );

  return (
    <form
      role="search"
      aria-label="Filter motors"
      onSubmit={(event) => event.preventDefault()}
      className="mb-4 grid grid-cols-2 items-end gap-3 rounded-lg border border-paper-300 bg-paper-50 p-4 md:grid-cols-4 xl:grid-cols-[repeat(7,minmax(0,1fr))_auto]"
    >
      {text('serialPrefix', 'Serial prefix', 'PM150-…')}
      <Field label="Product">
        <select value={filters.product} onChange={(event) => onChange({ product: event.target.value })} className={fieldClass}>
          <option value="">All products</option>
          {products.map((product) => (
            <option key={product.code} value={product.code}>
              {product.code} — {product.name}
            </option>
          ))}
        </select>
      </Field>
      {text('lot', 'Lot', 'Code')}
      <Field label="Status">
        <select value={filters.status} onChange={(event) => onChange({ status: event.target.value })} className={fieldClass}>
          <option value="">Any status</option>
          {statuses.map((status) => (
            <option key={status} value={status}>
              {status[0].toUpperCase() + status.slice(1)}
            </option>
          ))}
        </select>
      </Field>
      {text('station', 'Station', 'Code')}
      <Field label="Tested from">
        <input type="date" value={filters.from} onChange={(event) => onChange({ from: event.target.value })} className={fieldClass} />
      </Field>
      <Field label="Tested to">
        <input type="date" value={filters.to} onChange={(event) => onChange({ to: event.target.value })} className={fieldClass} />
      </Field>
      <Button variant="quiet" onClick={onClear}>
        Clear filters
      </Button>
    </form>
  );
}
