import { createHash } from 'node:crypto';

export type AuditContent = {
  occurredAt: string;
  actor: string;
  actorRole: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before: unknown;
  after: unknown;
  reason: string | null;
};

/** JSON with object keys sorted, so the same content always hashes the same way. */
export function canonicalJson(value: unknown): string {
  if (value === undefined) return 'null';
  if (value === null || typeof value !== 'object') return JSON.stringify(value);
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

/** SHA-256 over the previous row's hash and this row's canonical content (a hash chain). */
export function auditHash(prevHash: string, content: AuditContent): string {
  return createHash('sha256').update(prevHash).update('\n').update(canonicalJson(content)).digest('hex');
}

export const genesisHash = '0'.repeat(64);
