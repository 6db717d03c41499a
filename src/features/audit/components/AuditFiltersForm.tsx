import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/Button';
import type { AuditFilters } from '../api/get-audit-events';

const entityTypes = ['motor', 'lot', 'product', 'characteristic', 'limit_set', 'station', 'station_client', 'user'];
const inputClass = 'h-9 rounded-md border border-graphite-300 bg-white px-2 text-sm';

/** Entity, actor and date filters; dates are local calendar days, sent as UTC instants (to is the day after, exclusive). */
export function AuditFiltersForm({ onApply }: { onApply: (filters: AuditFilters) => void }) {
  const [entityType, setEntityType] = useState('');
  const [entityId, setEntityId] = useState('');
  const [actor, setActor] = useState('');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const dayAfter = (day: string) => new Date(new Date(`${day}T00:00:00`).getTime() + 86_400_000).toISOString();
    onApply({
      entityType: entityType || undefined,
      entityId: entityId.trim() || undefined,
      actor: actor.trim() || undefined,
      from: from ? new Date(`${from}T00:00:00`).toISOString() : undefined,
      to: to ? dayAfter(to) : undefined,
    });
  };

  return (
    <form onSubmit={submit} className="mb-4 flex flex-wrap items-end gap-3" aria-label="Filter the audit trail">
      <label className="flex flex-col text-xs text-graphite-600">Entity type
        <select data-testid="audit-filter-entity-type" className={inputClass} value={entityType} onChange={(e) => setEntityType(e.target.value)}>
          <option value="">Any</option>
          {entityTypes.map((t) => <option key={t} value={t}>{t}</option>)}
        </select>
      </label>
      <label className="flex flex-col text-xs text-graphite-600">Entity (serial, code or id)
        <input data-testid="audit-filter-entity-id" className={`${inputClass} figures`} value={entityId} onChange={(e) => setEntityId(e.target.value)} />
      </label>
      <label className="flex flex-col text-xs text-graphite-600">Actor
        <input data-testid="audit-filter-actor" className={inputClass} value={actor} onChange={(e) => setActor(e.target.value)} />
      </label>
      <label className="flex flex-col text-xs text-graphite-600">From
        <input type="date" data-testid="audit-filter-from" className={inputClass} value={from} onChange={(e) => setFrom(e.target.value)} />
      </label>
      <label className="flex flex-col text-xs text-graphite-600">To (inclusive)
        <input type="date" data-testid="audit-filter-to" className={inputClass} value={to} onChange={(e) => setTo(e.target.value)} />
      </label>
      <Button type="submit" variant="secondary" data-testid="audit-filter-apply">Show events</Button>
    </form>
  );
}
