import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { createPrng } from '../../seeds/demo/prng.js';
import { auditHash, canonicalJson, chainHash, genesisHash, plainDataCanonicalJson, storedContentJson, type AuditContent } from '../../server/services/audit/hash.js';

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

  it.each([
    ['keys out of order, nested', { z: 1, a: { y: [3, { b: 2, a: 1 }], x: null }, m: 'text' }],
    ['members left undefined', { b: undefined, a: 1, c: [undefined, 2] }],
    ['keys past ASCII, sorted by UTF-16 code unit', { 'é': 1, Z: 2, a: 3, '😀': 4, '\uffff': 5, '': 6, 'a\u0000': 7 }],
    ['dates, numbers and scalars', { at: new Date('2026-12-02T08:00:00.000Z'), n: [-0, 1e21, 0.1, Number.NaN, -1.5e-7], t: true, s: 'q"\\' }],
    ['a posted run', {
      runId: '3f2a5c1e-0000-4000-8000-000000000000', serial: 'PM150-0001', product: 'PM150', station: 'EOL-A1', lot: 'L-1',
      startedAt: '2026-12-02T08:00:00+01:00', finishedAt: '2026-12-02T08:01:00+01:00', operatorBadge: 'B-1', programVersion: '3.2.0',
      results: Array.from({ length: 40 }, (_, i) => ({ characteristic: `c${i}`, value: i / 7, unit: 'V' })),
    }],
  ])('when content is made canonical (%s), then the text equals that of the plain sort-and-join form', (_, value) => {
    // The straightforward form this function replaced; stored hashes (runs, audit) depend on the text staying the same.
    const reference = (v: unknown): string => {
      if (v === undefined) return 'null';
      if (v === null || typeof v !== 'object') return JSON.stringify(v);
      if (v instanceof Date) return JSON.stringify(v.toISOString());
      if (Array.isArray(v)) return `[${v.map(reference).join(',')}]`;
      const entries = Object.entries(v as Record<string, unknown>).filter(([, m]) => m !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
      return `{${entries.map(([k, m]) => `${JSON.stringify(k)}:${reference(m)}`).join(',')}}`;
    };
    expect(canonicalJson(value)).toBe(reference(value));
    // The form posted runs are hashed with (JSON.stringify with a sorted property list) must agree.
    expect(plainDataCanonicalJson(value)).toBe(reference(value));
  });

  it('when random plain data is made canonical, then both forms write the same text', () => {
    const prng = createPrng(20261202); // seeded, so a failure can be replayed
    const keys = ['a', 'b', 'Z', '10', '2', 'value', 'unit', 'é', '😀', '', 'a b', '"q"', 'runId', 'results', '__proto__'];
    const scalars = [0, -0, 1.5, -2e-9, 1e21, 'text', 'q"\\\n', '😀', true, false, null];
    const value = (depth: number): unknown => {
      const kind = depth > 3 ? 0 : prng.int(0, 2);
      if (kind === 0) return prng.pick(scalars);
      if (kind === 1) return Array.from({ length: prng.int(0, 3) }, () => value(depth + 1));
      // Built as JSON.parse builds objects (own data properties, "__proto__" included).
      return JSON.parse(`{${Array.from({ length: prng.int(0, 4) }, () => `${JSON.stringify(prng.pick(keys))}:${JSON.stringify(value(depth + 1))}`).join(',')}}`);
    };
    let withoutProtoKey = 0;
    for (let i = 0; i < 500; i++) {
      const sample = value(0);
      expect(plainDataCanonicalJson(sample)).toBe(canonicalJson(sample));
      if (!canonicalJson(sample).includes('"__proto__"')) withoutProtoKey++;
    }
    // Most samples take the property-list path, not the fallback for a "__proto__" key.
    expect(withoutProtoKey).toBeGreaterThan(250);
  });
});
