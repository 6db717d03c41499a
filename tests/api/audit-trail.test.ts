import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/index.js';
import { recordAudit } from '../../server/services/audit/record-audit.js';
import { verifyAuditChain } from '../../server/services/audit/verify-chain.js';
import { startApiServer } from '../support/api-server.js';
import { signedIn, type Agent } from './evidence-seed.js';

/** Empties only the chain (sessions stay, so the signed-in agents keep working). */
async function resetChain(server: RunningServer): Promise<void> {
  await server.db('audit_events').truncate();
  await server.db('audit_chain_head').where({ id: 1 }).update({ last_id: 0, last_hash: '0'.repeat(64) });
}

/** Twelve chained events over three entities and two actors, one per minute. */
async function writeEvents(server: RunningServer): Promise<number[]> {
  const ids: number[] = [];
  await server.db.transaction(async (trx) => {
    for (let i = 0; i < 12; i++) {
      ids.push(await recordAudit(trx, {
        actor: { name: i % 2 ? 'Quinn Author' : 'Ada Admin', role: i % 2 ? 'quality' : 'admin' },
        action: 'station.updated', entityType: i % 3 === 0 ? 'lot' : 'station', entityId: `E-${i % 3}`,
        before: { n: i }, after: { n: i + 1 }, reason: `change ${i}`, at: new Date(Date.UTC(2026, 10, 1, 8, i)),
      }));
    }
  });
  return ids;
}

describe('audit trail', () => {
  let server: RunningServer;
  let auditor: Agent;
  let ids: number[];
  beforeAll(async () => {
    server = await startApiServer();
    auditor = await signedIn(server.url, 'auditor');
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await resetChain(server);
    ids = await writeEvents(server);
  });

  it('when nothing was touched, then verify answers ok with every event checked', async () => {
    const response = await auditor.get('/api/v1/audit/verify').expect(200);
    expect(response.body).toEqual({ ok: true, checked: 12 });
  });

  it('when a row is UPDATEd directly in the database, then verify answers ok false at that row', async () => {
    await server.db('audit_events').where({ id: ids[4] }).update({ reason: 'quietly rewritten' });
    const response = await auditor.get('/api/v1/audit/verify').expect(200);
    expect(response.body).toMatchObject({ ok: false, checked: 4, firstBrokenId: ids[4] });
    expect(response.body.problem).toMatch(/altered/);
  });

  it('when a row is DELETEd directly in the database, then verify names the row after the gap', async () => {
    await server.db('audit_events').where({ id: ids[7] }).delete();
    const response = await auditor.get('/api/v1/audit/verify').expect(200);
    expect(response.body).toMatchObject({ ok: false, checked: 7, firstBrokenId: ids[8] });
    expect(response.body.problem).toMatch(/deleted/);
  });

  it('when the newest row is DELETEd, then verify reports the missing tail by its id', async () => {
    await server.db('audit_events').where({ id: ids[11] }).delete();
    const response = await auditor.get('/api/v1/audit/verify').expect(200);
    expect(response.body).toMatchObject({ ok: false, checked: 11, firstBrokenId: ids[11] });
  });

  it('when a JSON column holds another spelling of the same value, then verify still answers ok; a changed value does not', async () => {
    // The hash covers the canonical JSON; stored text with spaces and other key order is the same content.
    await server.db('audit_events').where({ id: ids[5] }).update({ after_json: '{ "n" : 6 }' });
    await server.db('audit_events').where({ id: ids[6] }).update({ before_json: '{"n":6.0}' });
    expect((await auditor.get('/api/v1/audit/verify').expect(200)).body).toEqual({ ok: true, checked: 12 });
    await server.db('audit_events').where({ id: ids[6] }).update({ before_json: '{"n":6.5}' });
    const response = await auditor.get('/api/v1/audit/verify').expect(200);
    expect(response.body).toMatchObject({ ok: false, checked: 6, firstBrokenId: ids[6] });
  });

  it('when the verification walks pages smaller than the chain, then a deleted row is still found at the page border', async () => {
    await server.db('audit_events').where({ id: ids[3] }).delete();
    expect(await verifyAuditChain(server.db, undefined, 2)).toMatchObject({ ok: false, checked: 3, firstBrokenId: ids[4] });
    expect(await verifyAuditChain(server.db, undefined, 4)).toMatchObject({ ok: false, checked: 3, firstBrokenId: ids[4] });
  });

  it('when the streaming variant is asked for, then NDJSON progress lines end with the verdict', async () => {
    await server.db('audit_events').where({ id: ids[2] }).update({ actor: 'Somebody Else' });
    const response = await auditor.get('/api/v1/audit/verify?stream=1').buffer(true).parse((res, done) => {
      let text = '';
      res.on('data', (chunk: Buffer) => { text += chunk.toString('utf8'); });
      res.on('end', () => done(null, text));
    }).expect(200);
    expect(response.headers['content-type']).toMatch(/application\/x-ndjson/);
    const lines = (response.body as string).trim().split('\n').map((line) => JSON.parse(line) as Record<string, unknown>);
    expect(lines.at(-1)).toMatchObject({ type: 'result', ok: false, firstBrokenId: ids[2] });
    expect(lines.slice(0, -1).every((l) => l.type === 'progress' && l.total === 12)).toBe(true);
  });

  it('when an operator, manager or quality user asks to verify, then it is refused with 403', async () => {
    for (const login of ['operator', 'manager', 'quality']) {
      const agent = await signedIn(server.url, login);
      await agent.get('/api/v1/audit/verify').expect(403);
    }
    const admin = await signedIn(server.url, 'admin');
    await admin.get('/api/v1/audit/verify').expect(200);
  });

  it('when events are filtered by entity and actor, then only those come back, newest first', async () => {
    const response = await auditor.get('/api/v1/audit/events?entityType=station&entityId=E-1&actor=Quinn%20Author').expect(200);
    const expected = ids.filter((_, i) => i % 3 === 1 && i % 2 === 1).reverse();
    expect(response.body.items.map((e: { id: number }) => e.id)).toEqual(expected);
    expect(response.body.items[0]).toMatchObject({ entityType: 'station', entityId: 'E-1', actor: 'Quinn Author', action: 'station.updated' });
  });

  it('when pages are followed by cursor within a date range, then they are disjoint and complete', async () => {
    const seen: number[] = [];
    let cursor: string | null = null;
    do {
      const query: string = `/api/v1/audit/events?limit=3&from=2026-11-01T08:02:00Z&to=2026-11-01T08:10:00Z${cursor ? `&cursor=${cursor}` : ''}`;
      const page = await auditor.get(query).expect(200);
      seen.push(...page.body.items.map((e: { id: number }) => e.id));
      cursor = page.body.nextCursor;
    } while (cursor);
    expect(seen).toEqual(ids.slice(2, 10).reverse());
  });

  it('when the cursor or date is malformed, then 422 names the field', async () => {
    const bad = await auditor.get('/api/v1/audit/events?cursor=abc').expect(422);
    expect(bad.body.error.fields[0].field).toBe('cursor');
    const badDate = await auditor.get('/api/v1/audit/events?from=yesterday').expect(422);
    expect(badDate.body.error.fields[0].field).toBe('from');
  });
});
