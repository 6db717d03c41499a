import { formatDateTime } from '../../../../lib/format';
import type { AuditEvent } from '../../api/motor-schemas';

/** What was done to this motor and its lot, oldest first, as the audit trail recorded it. */
export function AuditEventList({ events }: { events: AuditEvent[] }) {
  if (events.length === 0) return <p className="text-sm text-graphite-500">No audit events yet.</p>;
  return (
    <div className="overflow-x-auto rounded-lg border border-paper-300 bg-white">
      <table className="w-full text-sm">
        <thead className="bg-paper-200 text-left text-xs uppercase tracking-wider text-graphite-600">
          <tr>
            <th scope="col" className="px-3 py-1.5 font-medium">When</th>
            <th scope="col" className="px-3 py-1.5 font-medium">Who</th>
            <th scope="col" className="px-3 py-1.5 font-medium">What</th>
            <th scope="col" className="px-3 py-1.5 font-medium">On</th>
            <th scope="col" className="px-3 py-1.5 font-medium">Reason</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-200">
          {events.map((event) => (
            <tr key={event.id}>
              <td className="figures whitespace-nowrap px-3 py-1.5">{formatDateTime(event.occurredAt)}</td>
              <td className="px-3 py-1.5">
                {event.actor}
                {event.actorRole ? <span className="text-graphite-500"> ({event.actorRole})</span> : null}
              </td>
              <td className="figures px-3 py-1.5">{event.action}</td>
              <td className="px-3 py-1.5">
                {event.entityType} <span className="figures">{event.entityId}</span>
              </td>
              <td className="px-3 py-1.5 text-graphite-700">{event.reason ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
