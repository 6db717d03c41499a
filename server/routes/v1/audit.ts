import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { requirePermission } from '../../auth/principal.js';
import { listAuditEvents } from '../../services/audit/list-audit-events.js';
import { verifyAuditChain } from '../../services/audit/verify-chain.js';

const eventsQuery = z.object({
  entityType: z.string().trim().min(1).max(64).optional(),
  entityId: z.string().trim().min(1).max(255).optional(),
  actor: z.string().trim().min(1).max(255).optional(),
  from: z.iso.datetime({ offset: true }).or(z.iso.date()).transform((v) => new Date(v)).optional(),
  to: z.iso.datetime({ offset: true }).or(z.iso.date()).transform((v) => new Date(v)).optional(),
  cursor: z.coerce.number().int().positive('cursor must be an event id from a previous page').optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
}).refine((q) => !q.from || !q.to || q.from < q.to, { path: ['to'], message: 'to must be after from' });

const verifyQuery = z.object({ stream: z.enum(['0', '1']).default('0') });

/** The audit trail: browse events and prove the hash chain is whole. */
export function auditRouter(db: Knex) {
  const router = Router();

  router.get('/events', requirePermission('audit:read'), async (req, res) => {
    const query = eventsQuery.parse(req.query);
    res.json(await listAuditEvents(db, query));
  });

  router.get('/verify', requirePermission('audit:verify'), async (req, res) => {
    const { stream } = verifyQuery.parse(req.query);
    if (stream === '0') {
      res.json(await verifyAuditChain(db));
      return;
    }
    // One JSON object per line, so the screen can draw a progress bar while the chain is walked.
    res.status(200).type('application/x-ndjson').setHeader('cache-control', 'no-store');
    res.flushHeaders();
    try {
      const verdict = await verifyAuditChain(db, (checked, total) => {
        res.write(`${JSON.stringify({ type: 'progress', checked, total })}\n`);
      }, 2000);
      res.end(`${JSON.stringify({ type: 'result', ...verdict })}\n`);
    } catch (error) {
      console.error(error);
      res.end(`${JSON.stringify({ type: 'error', message: 'The chain could not be read to the end; try again.' })}\n`);
    }
  });

  return router;
}
