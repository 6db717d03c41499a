import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { auditHash, canonicalJson, chainHash, genesisHash, storedContentJson, type AuditContent } from '../../server/services/audit/hash.js';

const approval: AuditContent = {
  occurredAt: '2026-11-01T08:04:00.000Z', actor: 'Quinn Author', actorRole: 'quality', action: 'limit_set.approved',
  entityType: 'limit_set', entityId: '17', before: { status: 'draft', limits: [{ lsl: -2, usl: 2.5 }] },
  after: { status: 'approved', note: 'Prüfung „ok“ \u0007 "q"' }, reason: 'second approver',
};

/** The stored form of a content: JSON columns as recordAudit writes them (canonical text, or SQL NULL). */
function stored(content: AuditContent) {
  const { before, after, ...rest } = content;
  const text = (value: unknown) => (value === null ? null : canonicalJson(value));
  return { ...rest, beforeJson: text(before), afterJson: text(after) };
}

describe('audit chain hashing', () => {
  it('when an event recorded by the earlier implementation is hashed again, then the hash is unchanged', () => {
    // Computed with the implementation before storedContentJson/chainHash (createHash().update(prev).update('\n').update(json)).
    expect(auditHash(genesisHash, approval)).toBe('aa2f2bf813500f3e8c330f89c358997253b4836c8b3e22cfcefcd4ea231a5d0e');
  });

  it('when the chain hash is computed, then it is SHA-256 of previous hash, line feed and content (Node crypto as reference)', () => {
    const json = canonicalJson(approval);
    const reference = createHash('sha256').update(genesisHash).update('\n').update(json, 'utf8').digest('hex');
    expect(chainHash(genesisHash, json)).toBe(reference);
  });

  it.each([
    ['JSON objects on both sides', approval],
    ['no before, no role, no reason', { ...approval, before: null, actorRole: null, reason: null }],
    ['text needing escapes', { ...approval, actor: 'A "quoted" \\ name\n', entityId: 'PM150-0001\t', reason: '=cmd|calc 😀' }],
    ['scalars and arrays as JSON', { ...approval, before: 12.5, after: [1, 'two', null, { z: 1, a: [true] }] }],
  ])('when the content is built from stored columns (%s), then it equals canonicalJson of the parsed content', (_, content) => {
    expect(storedContentJson(stored(content as AuditContent))).toBe(canonicalJson(content));
  });
});
