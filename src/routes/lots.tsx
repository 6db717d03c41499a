import { Button } from '../components/Button';
import { EmptyState } from '../components/EmptyState';
import { ErrorNote } from '../components/ErrorNote';
import { PageHeader } from '../components/PageHeader';
import { LoadingScreen } from '../components/Spinner';
import { useLots } from '../features/lots/api/get-lots';
import { LotTable } from '../features/lots/components/LotTable';

export default function LotsRoute() {
  const lots = useLots();
  const items = lots.data?.pages.flatMap((page) => page.items) ?? [];

  return (
    <section>
      <PageHeader title="Lots" description="Production lots, newest first, with their motors counted by status." />
      {lots.isPending ? <LoadingScreen label="Loading lots…" /> : null}
      {lots.isError ? <ErrorNote error={lots.error} title="Could not load the lots" /> : null}
      {lots.isSuccess && items.length === 0 ? <EmptyState title="No lots yet">Lots appear when their first motor is tested.</EmptyState> : null}
      {items.length > 0 ? <LotTable lots={items} /> : null}
      {lots.hasNextPage ? (
        <div className="mt-3 flex justify-center">
          <Button variant="secondary" disabled={lots.isFetchingNextPage} onClick={() => void lots.fetchNextPage()}>
            {lots.isFetchingNextPage ? 'Loading…' : 'Show more lots'}
          </Button>
        </div>
      ) : null}
    </section>
  );
}
