import type { Product } from '../api/setup-schemas';
import { inputClass } from './form-parts';

type ProductPickerProps = { products: Product[]; value: string | undefined; onChange: (code: string) => void };

/** Which product the section is about; kept in the URL by the Setup screen. */
export function ProductPicker({ products, value, onChange }: ProductPickerProps) {
  return (
    <div className="flex items-center gap-2">
      <label htmlFor="setup-product" className="text-sm font-medium text-graphite-700">Product</label>
      <select id="setup-product" className={`${inputClass} w-auto min-w-72`} value={value ?? ''} onChange={(event) => onChange(event.target.value)}>
        <option value="" disabled>Choose a product…</option>
        {products.map((product) => (
          <option key={product.code} value={product.code}>{product.code} — {product.name}</option>
        ))}
      </select>
    </div>
  );
}
