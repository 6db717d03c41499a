import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { requirePermission } from '../../auth/principal.js';
import { findWhereUsed } from '../../services/trace/find-where-used.js';

const codeParam = z.object({ code: z.string().trim().min(1, 'give a supplier component lot code').max(64) });

/** Where-used is open to anyone who may read motors or lots; stations with records:read too. */
const mayTrace: RequestHandler = (req, res, next) => {
  const principal = req.principal;
  const action = principal?.kind === 'user' && principal.permissions.includes('lots:read') ? 'lots:read' : 'motors:read';
  requirePermission(action, { scopes: ['records:read'] })(req, res, next);
};

export function traceRouter(db: Knex) {
  const router = Router();
  router.get('/component-lots/:code', mayTrace, async (req, res) => {
    res.json(await findWhereUsed(db, codeParam.parse(req.params).code));
  });
  return router;
}
