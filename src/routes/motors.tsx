import { EmptyState } from '../components/EmptyState';
import { ErrorNote } from '../components/ErrorNote';
import { PageHeader } from '../components/PageHeader';
import { LoadingScreen } from '../components/Spinner';
import { useMotors } from '../features/motors/api/get-motors';
import { useProducts } from '../features/motors/api/get-products';
import { MotorFilters } from '../features/motors/components/list/MotorFilters';
import { MotorTable } from '../features/motors/components/list/MotorTable';
import { PageControls } from '../features/motors/components/list/PageControls';
import { useMotorListParams } from '../features/motors/hooks/use-motor-list-params';

export default function MotorsRoute() {
  const params = useMotorListParams();
  const motors = useMotors(params.query);
  const products = useProducts();

  return (
    <section>
      <PageHeader title="Motors" description="Every motor on record. Filter, sort, and open one to see its full record." />
      <MotorFilters filters={params.filters} products={products.data ?? []} onChange={params.update} onClear={params.clear} />
      {motors.isPending ? <LoadingScreen label="Loading motors…" /> : null}
      {motors.isError ? <ErrorNote error={motors.error} title="Could not load the motors" /> : null}
      {motors.data && motors.data.items.length === 0 ? (
        <EmptyState title="No motors match these filters">Widen the date range or clear a filter.</EmptyState>
      ) : null}
      {motors.data && motors.data.items.length > 0 ? (
        <>
          <MotorTable
            rows={motors.data.items}
            sort={params.sort}
            order={params.order}
            onSortChange={(sort, order) => params.update({ sort, order })}
            loading={motors.isPlaceholderData}
          />
          <PageControls
            pageNumber={params.pageNumber}
            canGoBack={params.paging.canGoBack}
            onFirstPage={params.onFirstPage}
            nextCursor={motors.data.nextCursor}
            onPrevious={params.paging.previous}
            onNext={params.paging.next}
            onFirst={params.paging.first}
          />
        </>
      ) : null}
    </section>
  );
}
