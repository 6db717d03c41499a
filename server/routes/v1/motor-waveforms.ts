import { Router } from 'express';
import type { Knex } from 'knex';
import type { BlobStore } from '../../blob-store/blob-store.js';
import { requirePermission } from '../../auth/principal.js';
import { getWaveformDisplay } from '../../services/waveforms/get-waveform-display.js';
import { param } from './param.js';

/** Mounted at /api/v1/motors beside the motors router: one run's waveform for display. */
export function motorWaveformsRouter(db: Knex, blobs: BlobStore) {
  const router = Router();
  router.get('/:serial/runs/:runId/waveforms/:kind', requirePermission('motors:read', { scopes: ['records:read'] }), async (req, res) => {
    res.json(await getWaveformDisplay(db, blobs, { serial: param(req, 'serial'), runId: param(req, 'runId'), kind: param(req, 'kind') }));
  });
  return router;
}
