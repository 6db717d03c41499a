import { useState } from 'react';
import { Button } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { useCan } from '../../auth/use-can';
import { useSetupProduct } from '../api/get-product';
import { useSetupProducts } from '../api/get-products';
import { CharacteristicsTable } from './CharacteristicsTable';
import { HipotPanel } from './HipotPanel';
import { ProductForm } from './ProductForm';
import { ProductPicker } from './ProductPicker';
import { SectionCard } from './form-parts';

type ProductsSectionProps = { productCode: string | undefined; onSelectProduct: (code: string) => void };

export function ProductsSection({ productCode, onSelectProduct }: ProductsSectionProps) {
  const canManage = useCan('products:manage');
  const products = useSetupProducts();
  const detail = useSetupProduct(productCode);
  const [creating, setCreating] = useState(false);

  if (products.isPending) return <LoadingScreen label="Loading products…" />;
  if (products.isError) return <ErrorNote error={products.error} title="Could not load the products" />;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <ProductPicker products={products.data} value={productCode} onChange={(code) => { setCreating(false); onSelectProduct(code); }} />
        {canManage && !creating ? <Button variant="secondary" onClick={() => setCreating(true)}>New product</Button> : null}
      </div>
      {creating ? (
        <SectionCard title="New product">
          <ProductForm onSaved={(code) => { setCreating(false); onSelectProduct(code); }} />
        </SectionCard>
      ) : null}
      {!productCode && !creating ? (
        <EmptyState title={products.data.length === 0 ? 'No products yet' : 'Choose a product'}>
          {products.data.length === 0 ? 'Create the first product to define its characteristics and limits.' : 'Its rating, characteristics and hipot voltage appear here.'}
        </EmptyState>
      ) : null}
      {productCode && detail.isError ? <ErrorNote error={detail.error} title={`Could not load ${productCode}`} /> : null}
      {productCode && detail.data ? (
        <div className="grid gap-4 xl:grid-cols-[3fr_2fr]">
          <SectionCard title={`Product ${detail.data.product.code}`}>
            {canManage ? <ProductForm key={detail.data.product.code} product={detail.data.product} /> : <ProductFacts code={detail.data.product.code} />}
          </SectionCard>
          <SectionCard title="Hipot test voltage">
            <HipotPanel productCode={detail.data.product.code} />
          </SectionCard>
          <div className="xl:col-span-2">
            <SectionCard title="Characteristics">
              <CharacteristicsTable productCode={detail.data.product.code} characteristics={detail.data.characteristics} canManage={canManage} />
            </SectionCard>
          </div>
        </div>
      ) : null}
    </div>
  );
}

/** Read-only rating for roles that may see Setup but not change products. */
function ProductFacts({ code }: { code: string }) {
  const { data } = useSetupProduct(code);
  if (!data) return null;
  const p = data.product;
  const facts: Array<[string, string]> = [
    ['Name', p.name], ['Motor kind', p.motorKind], ['Pole pairs', String(p.polePairs)],
    ['Resolver pole pairs', p.resolverPolePairs === null ? '—' : String(p.resolverPolePairs)],
    ['Rating', `${p.ratedVoltageV} V · ${p.ratedPowerKw} kW · ${p.ratedSpeedRpm} rpm`],
    ['Winding', `${p.windingMaterial}, ${p.windingType}-wound, class ${p.insulationClass}`], ['Serial pattern', p.serialPattern],
  ];
  return (
    <dl className="grid grid-cols-2 gap-2 text-sm">
      {facts.map(([term, value]) => (
        <div key={term}><dt className="text-xs uppercase tracking-wide text-graphite-500">{term}</dt><dd className="figures">{value}</dd></div>
      ))}
    </dl>
  );
}
