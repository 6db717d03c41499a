import { Router } from 'express';
import type { Knex } from 'knex';
import { requireScope } from '../../auth/principal.js';
import { testRunDocumentSchema } from '../../schemas/test-run.js';
import { ingestTestRun } from '../../services/runs/ingest-test-run.js';
import type { BlobStore } from '../../blob-store/blob-store.js';

/** One JSON document per run: 201 when stored, 200 for an identical retry, 409 for a reused runId. */
export function testRunsRouter(db: Knex, blobs: BlobStore) {
  const router = Router();
  router.post('/', requireScope('test-runs:write'), async (req, res) => {
    const document = testRunDocumentSchema.parse(req.body);
    const clientId = req.principal?.kind === 'client' ? req.principal.clientId : undefined;
    const outcome = await ingestTestRun(db, document, { clientId, blobs });
    res.status(outcome.status).json(outcome.body);
  });
  return router;
}
