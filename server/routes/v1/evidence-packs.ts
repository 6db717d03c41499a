import { Router } from 'express';
import { createReadStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { z } from 'zod';
import type { AppDeps } from '../../app.js';
import { currentUser, requirePermission } from '../../auth/principal.js';
import { packFilterSchema } from '../../services/evidence/pack-filter.js';
import { requestEvidencePack } from '../../services/evidence/request-evidence-pack.js';
import { getEvidencePack, listEvidencePacks, openEvidencePackFile } from '../../services/evidence/read-evidence-packs.js';
import { cancelEvidencePack } from '../../services/evidence/cancel-evidence-pack.js';

const idParam = z.object({ id: z.coerce.number().int().positive('id must be a pack number') });
const listQuery = z.object({
  cursor: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

/** Evidence packs: define one (queued for a background job), follow it, cancel it, download it. */
export function evidencePacksRouter({ db, config }: AppDeps) {
  const router = Router();

  router.post('/', requirePermission('evidence:create'), async (req, res) => {
    const filter = packFilterSchema.parse(req.body ?? {});
    const created = await requestEvidencePack(db, currentUser(req.principal), filter);
    res.status(202).location(`/api/v1/evidence-packs/${created.id}`).json(created);
  });

  router.get('/', requirePermission('evidence:read'), async (req, res) => {
    res.json(await listEvidencePacks(db, listQuery.parse(req.query)));
  });

  router.get('/:id', requirePermission('evidence:read'), async (req, res) => {
    res.json(await getEvidencePack(db, idParam.parse(req.params).id));
  });

  router.post('/:id/cancel', requirePermission('evidence:create'), async (req, res) => {
    res.json(await cancelEvidencePack(db, idParam.parse(req.params).id));
  });

  // Downloading hands out plant records, so it needs the same right as making a pack.
  router.get('/:id/download', requirePermission('evidence:create'), async (req, res) => {
    const file = await openEvidencePackFile(db, config.dataDir, idParam.parse(req.params).id);
    res.status(200).set({
      'content-type': 'application/zip',
      'content-length': String(file.sizeBytes),
      'content-disposition': `attachment; filename="${file.downloadName}"`,
      'x-fluxtrail-sha256': file.sha256,
      'cache-control': 'no-store',
    });
    try {
      await pipeline(createReadStream(file.path), res);
    } catch (error) {
      // Once bytes are on the wire the status cannot change; a client that hung up needs no answer.
      if (!res.headersSent) throw error;
      res.destroy();
    }
  });

  return router;
}
