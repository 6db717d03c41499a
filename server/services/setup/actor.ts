import type { Actor } from '../audit/record-audit.js';
import type { SessionUser } from '../../auth/session.js';

/** The person behind a Setup change, as the audit trail names them. */
export function actorOf(user: SessionUser): Actor {
  return { name: user.name, role: user.role };
}

/** An empty reason is no reason; the audit row then says so with null. */
export function reasonOf(reason: string | undefined): string | null {
  return reason && reason.length > 0 ? reason : null;
}

/** DATE columns come back as midnight-UTC Dates; the API speaks YYYY-MM-DD. */
export function isoDay(value: Date | string): string {
  return (value instanceof Date ? value.toISOString() : value).slice(0, 10);
}

export function isoTime(value: Date | null): string | null {
  return value ? value.toISOString() : null;
}
