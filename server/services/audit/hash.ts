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

/**
 * canonicalJson of plain JSON data (what JSON.parse yields: objects, arrays, strings, numbers,
 * booleans, null), written by JSON.stringify itself: given the sorted list of every key in the value
 * as its property list, it writes each object's members in that order. It allocates a fraction of
 * what canonicalJson's pieces and sorts do, and every posted run is hashed with it.
 */
export function plainDataCanonicalJson(value: unknown): string {
  const keys = new Set<string>();
  collectKeys(value, keys);
  // Listed, "__proto__" would be read from every object's prototype; the plain form then.
  if (keys.has('__proto__')) return canonicalJson(value);
  return JSON.stringify(value, [...keys].sort()) ?? 'null';
}

function collectKeys(value: unknown, into: Set<string>): void {
  if (value === null || typeof value !== 'object') return;
  if (Array.isArray(value)) {
    for (const item of value) collectKeys(item, into);
    return;
  }
  const record = value as Record<string, unknown>;
  for (const key in record) {
    if (!Object.hasOwn(record, key)) continue;
    into.add(key);
    collectKeys(record[key], into);
  }
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
