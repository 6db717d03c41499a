import { useState } from 'react';
import { Button } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { useCan } from '../../auth/use-can';
import { useCreateLimitDraft } from '../api/create-limit-draft';
import { useLimitSets } from '../api/get-limit-sets';
import { useSetupProduct } from '../api/get-product';
import { useSetupProducts } from '../api/get-products';
import { ProductPicker } from './ProductPicker';
import { RevisionDetail } from './RevisionDetail';
import { RevisionList } from './RevisionList';

type LimitRevisionsSectionProps = { productCode: string | undefined; onSelectProduct: (code: string) => void };

export function LimitRevisionsSection({ productCode, onSelectProduct }: LimitRevisionsSectionProps) {
  const products = useSetupProducts();
  return (
    <div className="space-y-4">
      {products.data ? <ProductPicker products={products.data} value={productCode} onChange={onSelectProduct} /> : null}
      {products.isError ? <ErrorNote error={products.error} title="Could not load the products" /> : null}
      {productCode ? <ProductRevisions key={productCode} productCode={productCode} /> : (
        <EmptyState title="Choose a product">Its limit revisions, drafts and approvals appear here.</EmptyState>
      )}
    </div>
  );
}

function ProductRevisions({ productCode }: { productCode: string }) {
  const canAuthor = useCan('limits:author');
  const limitSets = useLimitSets(productCode);
  const product = useSetupProduct(productCode);
  const createDraft = useCreateLimitDraft(productCode);
  const [chosenId, setChosenId] = useState<number>();

  if (limitSets.isPending || product.isPending) return <LoadingScreen label="Loading limit revisions…" />;
  if (limitSets.isError) return <ErrorNote error={limitSets.error} title="Could not load the limit revisions" />;
  if (product.isError) return <ErrorNote error={product.error} title={`Could not load ${productCode}`} />;

  const list = limitSets.data;
  const hasDraft = list.some((s) => s.status === 'draft');
  const hasInForce = list.some((s) => s.inForce);
  // Open the draft first (it is what someone is working on), else the revision in force.
  const selected = list.find((s) => s.id === chosenId) ?? list.find((s) => s.status === 'draft') ?? list.find((s) => s.inForce) ?? list[0];
  const start = (basis: 'in-force' | 'empty') => createDraft.mutate({ basis }, { onSuccess: (draft) => setChosenId(draft.id) });

  return (
    <div className="grid gap-4 lg:grid-cols-[18rem_1fr]">
      <div className="space-y-3">
        {canAuthor && !hasDraft ? (
          <div className="flex flex-col gap-2">
            {hasInForce ? <Button onClick={() => start('in-force')} disabled={createDraft.isPending}>New draft from the revision in force</Button> : null}
            <Button variant="secondary" onClick={() => start('empty')} disabled={createDraft.isPending}>New empty draft</Button>
          </div>
        ) : null}
        {createDraft.error ? <ErrorNote error={createDraft.error} title="No draft was started" /> : null}
        {list.length === 0 ? <EmptyState title="No revisions yet">A limits author starts the first draft.</EmptyState> : (
          <RevisionList limitSets={list} selectedId={selected?.id} onSelect={setChosenId} />
        )}
      </div>
      {selected ? (
        // Keeps the just-approved revision on screen instead of jumping to the one in force.
        <RevisionDetail productCode={productCode} limitSet={selected} characteristics={product.data.characteristics} onApproved={() => setChosenId(selected.id)} />
      ) : null}
    </div>
  );
}
