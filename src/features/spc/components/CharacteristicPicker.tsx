import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { useSpcCharacteristics } from '../api/get-characteristics';

type Props = { product: string; characteristicId: number | null; onChange: (next: { product: string; characteristicId: number | null }) => void };

/** Product, then one of its characteristics; the status says whether limits are trial or frozen. */
export function CharacteristicPicker({ product, characteristicId, onChange }: Props) {
  const { data, error, isPending } = useSpcCharacteristics();
  if (isPending) return <Spinner />;
  if (error) return <ErrorNote error={error} title="Could not load characteristics" />;
  const products = [...new Set(data.characteristics.map((c) => c.product))];
  const chosenProduct = product || products[0] || '';
  const ofProduct = data.characteristics.filter((c) => c.product === chosenProduct);
  return (
    <div className="flex flex-wrap gap-4">
      <label className="text-sm font-medium">Product
        <select aria-label="Product" value={chosenProduct} onChange={(e) => onChange({ product: e.target.value, characteristicId: null })} className="ml-2 rounded border border-graphite-300 px-2 py-1">
          {products.map((p) => <option key={p} value={p}>{p}</option>)}
        </select>
      </label>
      <label className="text-sm font-medium">Characteristic
        <select aria-label="Characteristic" value={characteristicId ?? ''} onChange={(e) => onChange({ product: chosenProduct, characteristicId: e.target.value ? Number(e.target.value) : null })} className="ml-2 rounded border border-graphite-300 px-2 py-1">
          <option value="">Choose…</option>
          {ofProduct.map((c) => (
            <option key={c.id} value={c.id}>{c.name} ({c.unit}){c.limitsStatus ? ` — ${c.limitsStatus}` : ''}{c.spcEnabled ? '' : ' — SPC off'}</option>
          ))}
        </select>
      </label>
    </div>
  );
}
