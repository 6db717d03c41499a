import { useState } from 'react';
import { PageHeader } from '../components/PageHeader';
import { useCan } from '../features/auth/use-can';
import type { AuditFilters } from '../features/audit/api/get-audit-events';
import { AuditEventsTable } from '../features/audit/components/AuditEventsTable';
import { AuditFiltersForm } from '../features/audit/components/AuditFiltersForm';
import { ChainVerifier } from '../features/audit/components/ChainVerifier';

export default function AuditTrailRoute() {
  const canVerify = useCan('audit:verify');
  const [filters, setFilters] = useState<AuditFilters>({});
  const [startAt, setStartAt] = useState<number | undefined>();
  // A new filter or a jump to a break starts the table afresh (its paging state is keyed on these).
  const tableKey = JSON.stringify([filters, startAt]);
  return (
    <div>
      <PageHeader title="Audit trail" description="Every change to limits, holds, signals, roles and stations, chained by hash so an edit or deletion shows." />
      {canVerify ? <ChainVerifier onShowEvent={(id) => { setFilters({}); setStartAt(id); }} /> : null}
      <AuditFiltersForm onApply={(next) => { setStartAt(undefined); setFilters(next); }} />
      <AuditEventsTable key={tableKey} filters={filters} startAt={startAt} />
    </div>
  );
}
