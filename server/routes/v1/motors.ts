import { Router, type Request, type Response } from 'express';
import type { Knex } from 'knex';
import { requirePermission } from '../../auth/principal.js';
import type { Action } from '../../auth/permissions.js';
import { unauthenticated } from '../../errors.js';
import { listMotors } from '../../services/motors/list-motors.js';
import { getMotor } from '../../services/motors/get-motor.js';
import { placeHold } from '../../services/holds/place-hold.js';
import { recordReworkNote } from '../../services/rework/record-rework-note.js';
import { motorListQuerySchema, reasonBodySchema, reworkNoteBodySchema } from './request-schemas.js';
import { actorOf } from './actor.js';
import { param } from './param.js';

const readScopes = ['records:read'] as const;

/** The one policy check, for a route whose needed action depends on the body. */
function authorize(req: Request, res: Response, action: Action) {
  requirePermission(action)(req, res, () => undefined);
}

export function motorsRouter(db: Knex) {
  const router = Router();
  router.get('/', requirePermission('motors:read', { scopes: readScopes }), async (req, res) => {
    const query = motorListQuerySchema.parse(req.query);
    res.json(await listMotors(db, {
      ...query, from: query.from ? new Date(query.from) : undefined, to: query.to ? new Date(query.to) : undefined,
    }));
  });
  router.get('/:serial', requirePermission('motors:read', { scopes: readScopes }), async (req, res) => {
    res.json(await getMotor(db, param(req, 'serial')));
  });
  router.post('/:serial/rework-notes', async (req, res) => {
    if (!req.principal) throw unauthenticated();
    const body = reworkNoteBodySchema.parse(req.body);
    authorize(req, res, body.action === 'rework' ? 'rework:record' : 'retest:request');
    res.status(201).json(await recordReworkNote(db, { serial: param(req, 'serial'), ...body, actor: actorOf(req) }));
  });
  router.post('/:serial/holds', requirePermission('holds:place'), async (req, res) => {
    const { reason } = reasonBodySchema.parse(req.body);
    res.status(201).json(await placeHold(db, { target: { type: 'motor', serial: param(req, 'serial') }, kind: 'manual', reason, actor: actorOf(req) }));
  });
  return router;
}
