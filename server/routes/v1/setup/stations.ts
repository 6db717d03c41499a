import { Router } from 'express';
import type { Knex } from 'knex';
import { currentUser, requirePermission } from '../../../auth/principal.js';
import { pathParam } from './path-param.js';
import { calibrationSchema, stationCreateSchema, stationUpdateSchema } from '../../../schemas/setup.js';
import { createStation, listCalibrations, listStations, recordCalibration, updateStation } from '../../../services/setup/index.js';

/** /api/v1/setup/stations: stations and their calibration history. */
export function stationsRouter(db: Knex) {
  const router = Router();
  const read = requirePermission('setup:read');
  const manage = requirePermission('stations:manage');

  router.get('/', read, async (_req, res) => {
    res.json({ stations: await listStations(db) });
  });
  router.post('/', manage, async (req, res) => {
    const input = stationCreateSchema.parse(req.body);
    res.status(201).json({ station: await createStation(db, currentUser(req.principal), input) });
  });
  router.put('/:code', manage, async (req, res) => {
    const input = stationUpdateSchema.parse(req.body);
    res.json({ station: await updateStation(db, currentUser(req.principal), pathParam(req, 'code'), input) });
  });
  router.get('/:code/calibrations', read, async (req, res) => {
    res.json({ calibrations: await listCalibrations(db, pathParam(req, 'code')) });
  });
  router.post('/:code/calibrations', manage, async (req, res) => {
    const input = calibrationSchema.parse(req.body);
    res.status(201).json(await recordCalibration(db, currentUser(req.principal), pathParam(req, 'code'), input));
  });
  return router;
}
