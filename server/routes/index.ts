import { Router, json } from 'express';
import type { AppDeps } from '../app.js';
import { healthRouter } from './health.js';
import { meRouter } from './me.js';
import { auditRouter } from './v1/audit.js';
import { evidencePacksRouter } from './v1/evidence-packs.js';
import { traceRouter } from './v1/trace.js';
import { v1Router } from './v1/index.js';
import { openapiRouter } from '../openapi/router.js';
import { setupRouter } from './v1/setup/index.js';
import { spcRouter } from './v1/spc.js';
import { signalsRouter } from './v1/signals.js';
import { yieldRouter } from './v1/yield.js';
import { uploadsRouter } from './v1/uploads.js';
import { join } from 'node:path';
import { fileBlobStore } from '../blob-store/file-blob-store.js';

// A run may carry waveforms of up to 4 × 500k samples (MAX_SAMPLES_PER_CHANNEL); as JSON with
// full-precision numbers that is about 42 MB, so only this route accepts bodies that large.
const TEST_RUN_BODY_LIMIT = '64mb';

/** Every API router, one per resource. */
export function apiRouter({ db, config }: AppDeps) {
  const router = Router();
  router.use('/health', healthRouter(db));
  router.use('/v1/test-runs', json({ limit: TEST_RUN_BODY_LIMIT }));
  router.use(json({ limit: '1mb' }));
  router.use('/me', meRouter());
  router.use('/v1/audit', auditRouter(db));
  router.use('/v1/evidence-packs', evidencePacksRouter({ db, config }));
  router.use('/v1/trace', traceRouter(db));
  router.use('/v1/setup', setupRouter(db));
  router.use('/v1/spc', spcRouter(db));
  router.use('/v1/signals', signalsRouter(db));
  router.use('/v1/yield', yieldRouter(db));
  router.use('/v1/uploads', uploadsRouter({ db, config }));
  router.use('/v1', v1Router(db, fileBlobStore(join(config.dataDir, 'blobs'))));
  router.use(openapiRouter(config.oidc.issuer));
  return router;
}
