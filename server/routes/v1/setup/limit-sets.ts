import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser, requirePermission } from '../../../auth/principal.js';
import { pathParam } from './path-param.js';
import { notFound } from '../../../errors.js';
import { approveSchema, discardSchema, draftCreateSchema, draftLimitsSchema, retireSchema } from '../../../schemas/setup.js';
import {
  approveLimitSet, createLimitDraft, discardLimitDraft, getLimitSet, limitSetDifference, listLimitSets,
  replaceDraftLimits, retireLimitSet,
} from '../../../services/setup/index.js';

const idSchema = z.coerce.number().int().positive();

function limitSetId(req: Request): number {
  const raw = pathParam(req, 'id');
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw notFound(`No limit revision with the id ${raw}.`);
  return parsed.data;
}

/** Revisions of one product: /api/v1/setup/products/:code/limit-sets. */
export function productLimitSetsRouter(db: Knex) {
  const router = Router({ mergeParams: true });
  router.get('/', requirePermission('setup:read'), async (req, res) => {
    res.json({ limitSets: await listLimitSets(db, currentUser(req.principal), pathParam(req, 'code')) });
  });
  router.post('/', requirePermission('limits:author'), async (req, res) => {
    const input = draftCreateSchema.parse(req.body);
    res.status(201).json({ limitSet: await createLimitDraft(db, currentUser(req.principal), pathParam(req, 'code'), input) });
  });
  return router;
}

/** One revision by id: /api/v1/setup/limit-sets/:id, its limits, difference and life cycle. */
export function limitSetsRouter(db: Knex) {
  const router = Router();
  router.get('/:id', requirePermission('setup:read'), async (req, res) => {
    res.json({ limitSet: await getLimitSet(db, currentUser(req.principal), limitSetId(req)) });
  });
  router.get('/:id/difference', requirePermission('setup:read'), async (req, res) => {
    res.json({ difference: await limitSetDifference(db, limitSetId(req)) });
  });
  router.put('/:id/limits', requirePermission('limits:author'), async (req, res) => {
    const input = draftLimitsSchema.parse(req.body);
    res.json({ limitSet: await replaceDraftLimits(db, currentUser(req.principal), limitSetId(req), input) });
  });
  router.post('/:id/approve', requirePermission('limits:approve'), async (req, res) => {
    const input = approveSchema.parse(req.body);
    res.json({ limitSet: await approveLimitSet(db, currentUser(req.principal), limitSetId(req), input) });
  });
  router.post('/:id/retire', requirePermission('limits:approve'), async (req, res) => {
    const input = retireSchema.parse(req.body);
    res.json({ limitSet: await retireLimitSet(db, currentUser(req.principal), limitSetId(req), input) });
  });
  router.post('/:id/discard', requirePermission('limits:author'), async (req, res) => {
    const input = discardSchema.parse(req.body ?? {});
    res.json({ discarded: await discardLimitDraft(db, currentUser(req.principal), limitSetId(req), input.reason) });
  });
  return router;
}
