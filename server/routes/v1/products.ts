import { Router } from 'express';
import type { Knex } from 'knex';
import { requirePermission } from '../../auth/principal.js';
import { listProducts, getTestPlan } from '../../services/runs/test-plan.js';
import { testPlanQuerySchema } from './request-schemas.js';
import { param } from './param.js';

/** Stands load their plan here; people with motors:read may read it too. */
export const productReadScopes = ['test-runs:write', 'records:read'] as const;

export function productsRouter(db: Knex) {
  const router = Router();
  const canRead = requirePermission('motors:read', { scopes: productReadScopes });
  router.get('/', canRead, async (_req, res) => {
    res.json({ items: await listProducts(db) });
  });
  router.get('/:code/test-plan', canRead, async (req, res) => {
    const { at } = testPlanQuerySchema.parse(req.query);
    res.json(await getTestPlan(db, param(req, 'code'), at ? new Date(at) : new Date()));
  });
  return router;
}
