import { Router } from 'express';
import type { Knex } from 'knex';
import { requireScope } from '../../auth/principal.js';
import { notFound } from '../../errors.js';
import { stationOfClient } from '../../services/runs/station-of-client.js';

/** A stand asks which station its client credentials stand for, and when calibration falls due. */
export function stationsMeRouter(db: Knex) {
  const router = Router();
  router.get('/', requireScope('test-runs:write'), async (req, res) => {
    const clientId = req.principal?.kind === 'client' ? req.principal.clientId : '';
    const station = await stationOfClient(db, clientId);
    if (!station) throw notFound(`Client ${clientId} is bound to no station; an admin binds it in Setup.`);
    res.json({ code: station.code, line: station.line, kind: station.kind, name: station.name, calibrationDue: station.calibrationDue });
  });
  return router;
}
