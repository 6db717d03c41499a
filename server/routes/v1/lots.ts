import { Router } from 'express';
import type { Knex } from 'knex';
import { requirePermission } from '../../auth/principal.js';
import { listLots } from '../../services/lots/list-lots.js';
import { getLot } from '../../services/lots/get-lot.js';
import { placeHold } from '../../services/holds/place-hold.js';
import { releaseHold } from '../../services/holds/release-hold.js';
import { holdIdParamSchema, lotListQuerySchema, reasonBodySchema } from './request-schemas.js';
import { actorOf } from './actor.js';
import { param } from './param.js';

const readScopes = ['records:read'] as const;

export function lotsRouter(db: Knex) {
  const router = Router();
  router.get('/', requirePermission('lots:read', { scopes: readScopes }), async (req, res) => {
    res.json(await listLots(db, lotListQuerySchema.parse(req.query)));
  });
  router.get('/:code', requirePermission('lots:read', { scopes: readScopes }), async (req, res) => {
    res.json(await getLot(db, param(req, 'code')));
  });
  router.post('/:code/holds', requirePermission('holds:place'), async (req, res) => {
    const { reason } = reasonBodySchema.parse(req.body);
    res.status(201).json(await placeHold(db, { target: { type: 'lot', code: param(req, 'code') }, kind: 'manual', reason, actor: actorOf(req) }));
  });
  return router;
}

/** Holds are placed on their motor or lot; releasing one only needs its id. */
export function holdsRouter(db: Knex) {
  const router = Router();
  router.post('/:id/release', requirePermission('holds:release'), async (req, res) => {
    const holdId = holdIdParamSchema.parse(param(req, 'id'));
    const { reason } = reasonBodySchema.parse(req.body);
    res.json(await releaseHold(db, { holdId, reason, actor: actorOf(req) }));
  });
  return router;
}
