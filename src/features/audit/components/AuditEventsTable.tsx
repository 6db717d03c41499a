import { useState } from 'react';
import { Button } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { formatDateTime } from '../../../lib/format';
import { useAuditEvents, type AuditFilters } from '../api/get-audit-events';

const pageSize = 50;

function change(before: unknown, after: unknown): string {
  const text = (v: unknown) => (v === null || v === undefined ? '—' : JSON.stringify(v));
  return `${text(before)} → ${text(after)}`;
}

/** The events, newest first, a page at a time; `startAt` shows the page beginning at one event (a chain break). */
export function AuditEventsTable({ filters, startAt }: { filters: AuditFilters; startAt?: number }) {
  const [cursors, setCursors] = useState<string[]>([]);
  const initial = startAt !== undefined ? String(startAt + 1) : undefined;
  const cursor = cursors.at(-1) ?? initial;
  const events = useAuditEvents({ ...filters, cursor, limit: pageSize });

  if (events.isPending) return <LoadingScreen label="Loading events…" />;
  if (events.isError) return <ErrorNote error={events.error} title="Could not load the audit trail" />;
  if (events.data.items.length === 0) return <EmptyState title="No events match">Widen the filters or clear the dates.</EmptyState>;

  return (
    <div>
      <div className="overflow-x-auto rounded-lg border border-paper-300 bg-white">
        <table data-testid="audit-events-table" className="w-full text-left text-sm">
          <thead className="bg-paper-200 text-xs uppercase tracking-wide text-graphite-600">
            <tr><th className="px-3 py-2">Event</th><th className="px-3 py-2">Time</th><th className="px-3 py-2">Actor</th><th className="px-3 py-2">Action</th><th className="px-3 py-2">Entity</th><th className="px-3 py-2">Change</th><th className="px-3 py-2">Reason</th></tr>
          </thead>
          <tbody>
            {events.data.items.map((e) => (
              <tr key={e.id} data-testid="audit-event-row" data-event-id={e.id} className={`border-t border-paper-200 align-top ${e.id === startAt ? 'bg-fail-soft' : ''}`}>
                <td className="figures px-3 py-2">{e.id}</td>
                <td className="figures whitespace-nowrap px-3 py-2">{formatDateTime(e.occurredAt)}</td>
                <td className="px-3 py-2">{e.actor}{e.actorRole ? <span className="text-graphite-500"> ({e.actorRole})</span> : null}</td>
                <td className="px-3 py-2">{e.action}</td>
                <td className="figures px-3 py-2">{e.entityType} {e.entityId}</td>
                <td className="figures max-w-md truncate px-3 py-2" title={change(e.before, e.after)}>{change(e.before, e.after)}</td>
                <td className="px-3 py-2">{e.reason ?? '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="mt-3 flex gap-2">
        <Button variant="secondary" size="sm" disabled={cursors.length === 0} onClick={() => setCursors(cursors.slice(0, -1))}>Newer</Button>
        <Button variant="secondary" size="sm" data-testid="audit-events-older" disabled={!events.data.nextCursor}
          onClick={() => events.data.nextCursor && setCursors([...cursors, events.data.nextCursor])}>Older</Button>
      </div>
    </div>
  );
}
