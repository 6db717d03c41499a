import { hash } from 'node:crypto';

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

/** An event's content as stored: the JSON columns still as the canonical text recordAudit wrote. */
export type StoredAuditContent = Omit<AuditContent, 'before' | 'after'> & { beforeJson: string | null; afterJson: string | null };

/**
 * JSON with object keys sorted, so the same content always hashes the same way. Written as plain
 * loops: every posted run is hashed with it (retries are recognised by that hash).
 */
export function canonicalJson(value: unknown): string {
  if (value === undefined) return 'null';
  if (value === null || typeof value !== 'object') return JSON.stringify(value);
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  if (Array.isArray(value)) {
    let text = '[';
    for (let i = 0; i < value.length; i++) text += (i === 0 ? '' : ',') + canonicalJson(value[i]);
    return `${text}]`;
  }
  const record = value as Record<string, unknown>;
  // The default sort compares UTF-16 code units, as < and > do on strings.
  const keys = Object.keys(record).sort();
  let text = '{';
  for (const key of keys) {
    const member = record[key];
    if (member === undefined) continue;
    text += `${text.length === 1 ? '' : ','}${JSON.stringify(key)}:${canonicalJson(member)}`;
  }
  return `${text}}`;
}

function jsonText(value: string | null): string {
  return value === null ? 'null' : JSON.stringify(value);
}

/**
 * canonicalJson of the content, built from the stored columns without parsing and re-writing the
 * JSON ones: the keys in canonicalJson's sorted order, the stored JSON text spliced in as is. It
 * equals canonicalJson(content) whenever the stored text is canonical, which recordAudit ensures.
 */
export function storedContentJson(c: StoredAuditContent): string {
  return `{"action":${JSON.stringify(c.action)},"actor":${JSON.stringify(c.actor)},"actorRole":${jsonText(c.actorRole)},`
    + `"after":${c.afterJson ?? 'null'},"before":${c.beforeJson ?? 'null'},"entityId":${JSON.stringify(c.entityId)},`
    + `"entityType":${JSON.stringify(c.entityType)},"occurredAt":${JSON.stringify(c.occurredAt)},"reason":${jsonText(c.reason)}}`;
}

/** SHA-256 (hex) over the previous row's hash, a line break and this row's canonical content (a hash chain). */
export function chainHash(prevHash: string, contentJson: string): string {
  return hash('sha256', `${prevHash}\n${contentJson}`);
}

export function auditHash(prevHash: string, content: AuditContent): string {
  return chainHash(prevHash, canonicalJson(content));
}

export const genesisHash = '0'.repeat(64);
