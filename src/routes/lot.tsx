import type { ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import { EmptyState } from '../components/EmptyState';
import { ErrorNote } from '../components/ErrorNote';
import { PageHeader } from '../components/PageHeader';
import { LoadingScreen } from '../components/Spinner';
import { useCan } from '../features/auth/use-can';
import { useLot } from '../features/lots/api/get-lot';
import { LotCountsSummary } from '../features/lots/components/LotCountsSummary';
import { LotHolds } from '../features/lots/components/LotHolds';
import { LotMotorList } from '../features/lots/components/LotMotorList';
import { PlaceLotHoldButton } from '../features/lots/components/PlaceLotHoldButton';
import { isApiError } from '../lib/api-client';
import { formatDate } from '../lib/format';

function Part({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="space-y-3">
      <h2 className="text-lg font-semibold text-graphite-950">{title}</h2>
      {children}
    </section>
  );
}

export default function LotRoute() {
  const { code = '' } = useParams();
  const lot = useLot(code);
  const canPlace = useCan('holds:place');
  const canRelease = useCan('holds:release');

  if (lot.isPending) return <LoadingScreen label="Loading the lot…" />;
  if (lot.isError) {
    if (isApiError(lot.error) && lot.error.status === 404) {
      return <EmptyState title={`Lot not found: ${code}`}>No lot with this code is on record.</EmptyState>;
    }
    return <ErrorNote error={lot.error} title="Could not load the lot" />;
  }

  const record = lot.data;
  // One active manual hold per lot (the server refuses a second), so the button gives way to a pointer.
  const manualHold = record.holds.find((hold) => hold.kind === 'manual' && !hold.releasedAt);
  const holdAction = manualHold ? (
    <p className="text-sm text-graphite-600">
      On manual hold since <span className="figures">{formatDate(manualHold.placedAt)}</span> (hold{' '}
      <span className="figures">{manualHold.id}</span>); see Holds below.
    </p>
  ) : (
    <PlaceLotHoldButton lotCode={record.code} />
  );
  return (
    <article className="space-y-8">
      <PageHeader
        title={`Lot ${record.code}`}
        description={
          <>
            {record.product.name} <span className="figures">{record.product.code}</span> · created{' '}
            <span className="figures">{formatDate(record.createdAt)}</span>
          </>
        }
        actions={canPlace ? holdAction : null}
      />
      <LotCountsSummary counts={record.counts} large />
      <Part title="Component lots">
        {record.components.length === 0 ? (
          <p className="text-sm text-graphite-500">No component lots recorded.</p>
        ) : (
          <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
            {record.components.map((component) => (
              <div key={`${component.kind}:${component.supplierLotCode}`} className="rounded-md border border-paper-300 bg-white px-3 py-2">
                <dt className="text-xs uppercase tracking-wider text-graphite-500">{component.kind}</dt>
                <dd className="figures text-graphite-950">{component.supplierLotCode}</dd>
                {component.supplier ? <dd className="text-xs text-graphite-500">{component.supplier}</dd> : null}
              </div>
            ))}
          </dl>
        )}
      </Part>
      <Part title="Holds">
        <LotHolds lotCode={record.code} holds={record.holds} canRelease={canRelease} />
      </Part>
      <Part title="Motors">
        <LotMotorList motors={record.motors} />
      </Part>
    </article>
  );
}
