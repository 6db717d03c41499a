import type { Product } from '../api/setup-schemas';

type ProductPickerProps = { products: Product[]; value: string | undefined; onChange: (code: string) => void };

/** Which product the section is about; kept in the URL by the Setup screen. */
export function ProductPicker({ products, value, onChange }: ProductPickerProps) {
  return (
    <div className="flex items-center gap-2">
      <label htmlFor="setup-product" className="text-sm font-medium text-graphite-700">Product</label>
      <select id="setup-product" className="h-9 min-w-72 rounded-md border border-graphite-300 bg-white px-2 text-sm text-graphite-900" value={value ?? ''} onChange={(event) => onChange(event.target.value)}>
        <option value="" disabled>Choose a product…</option>
        {products.map((product) => (
          <option key={product.code} value={product.code}>{product.code} — {product.name}</option>
        ))}
      </select>
    </div>
  );
}
