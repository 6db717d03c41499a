import { Router } from 'express';
import type { Knex } from 'knex';
import { currentUser, requirePermission } from '../../../auth/principal.js';
import { pathParam } from './path-param.js';
import { discardSchema, stationClientSchema } from '../../../schemas/setup.js';
import { bindStationClient, listStationClients, unbindStationClient } from '../../../services/setup/index.js';

/** /api/v1/setup/station-clients: which OAuth client id posts runs for which station. */
export function stationClientsRouter(db: Knex) {
  const router = Router();
  router.get('/', requirePermission('setup:read'), async (_req, res) => {
    res.json({ stationClients: await listStationClients(db) });
  });
  router.post('/', requirePermission('stations:manage'), async (req, res) => {
    const input = stationClientSchema.parse(req.body);
    res.json({ stationClient: await bindStationClient(db, currentUser(req.principal), input) });
  });
  router.post('/:clientId/unbind', requirePermission('stations:manage'), async (req, res) => {
    const input = discardSchema.parse(req.body ?? {});
    res.json({ stationClient: await unbindStationClient(db, currentUser(req.principal), pathParam(req, 'clientId'), input.reason) });
  });
  return router;
}
