import { auditHash, canonicalJson, type AuditContent } from '../server/services/audit/hash.js';
import { verifyAuditChain } from '../server/services/audit/verify-chain.js';
import type { BenchContext } from './harness.js';
import { round } from './stats.js';

const eventCount = 1_000_000;

/** Appends events to the chain in bulk (hashes computed exactly as recordAudit does), once. */
async function ensureAuditEvents(ctx: BenchContext): Promise<void> {
  const marker = await ctx.db('app_meta').where({ meta_key: 'bench_audit_events' }).first();
  if (marker) return;
  ctx.log(`audit: writing ${eventCount.toLocaleString('en')} chained events…`);
  const head = await ctx.db('audit_chain_head').where({ id: 1 }).first();
  let prevHash: string = head.last_hash;
  let lastId = Number(head.last_id);
  const start = Date.parse('2026-01-01T00:00:00Z');
  for (let batch = 0; batch < eventCount / 5000; batch++) {
    const rows = [];
    for (let i = 0; i < 5000; i++) {
      const n = batch * 5000 + i;
      const content: AuditContent = {
        occurredAt: new Date(start + n * 30_000).toISOString(), actor: 'bench quality', actorRole: 'quality',
        action: n % 2 ? 'hold.placed' : 'hold.released', entityType: 'motor', entityId: `BX${String(n % 250).padStart(3, '0')}-${String(n % 1000).padStart(5, '0')}`,
        before: null, after: { reason: 'bench', n }, reason: 'bench',
      };
      const hash = auditHash(prevHash, content);
      lastId += 1;
      rows.push({
        id: lastId, occurred_at: new Date(content.occurredAt), actor: content.actor, actor_role: content.actorRole, action: content.action,
        entity_type: content.entityType, entity_id: content.entityId, before_json: null, after_json: canonicalJson(content.after),
        reason: content.reason, prev_hash: prevHash, hash,
      });
      prevHash = hash;
    }
    await ctx.db('audit_events').insert(rows);
  }
  await ctx.db('audit_chain_head').where({ id: 1 }).update({ last_id: lastId, last_hash: prevHash });
  await ctx.db('app_meta').insert({ meta_key: 'bench_audit_events', meta_value: String(eventCount), updated_at: new Date() });
}

/** Verification of the whole chain (target ≤ 10 s for 1M events). */
export async function benchAuditChain(ctx: BenchContext) {
  await ensureAuditEvents(ctx);
  ctx.log('audit: verifying the chain…');
  const start = performance.now();
  const verdict = await verifyAuditChain(ctx.db);
  const seconds = (performance.now() - start) / 1000;
  return { events: verdict.checked, ok: verdict.ok, verifySeconds: round(seconds, 2), target: '≤ 10 s for 1M events' };
}
