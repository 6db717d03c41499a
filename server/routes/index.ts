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

/** Every API router, one per resource. */
export function apiRouter({ db, config }: AppDeps) {
  const router = Router();
  router.use('/health', healthRouter(db));
  router.use(json({ limit: '1mb' }));
  router.use('/me', meRouter());
  router.use('/v1/audit', auditRouter(db));
  router.use('/v1/evidence-packs', evidencePacksRouter({ db, config }));
  router.use('/v1/trace', traceRouter(db));
  router.use('/v1/setup', setupRouter(db));
  router.use('/v1/spc', spcRouter(db));
  router.use('/v1/signals', signalsRouter(db));
  router.use('/v1/yield', yieldRouter(db));
  router.use('/v1', v1Router(db));
  router.use(openapiRouter(config.oidc.issuer));
  return router;
}
