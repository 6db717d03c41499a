import { Router } from 'express';
import { buildOpenApiDocument } from './document.js';
import { docsPageHtml, docsPageScript } from './docs-page.js';

/** GET /api/openapi.json (the document) and GET /api/docs (a plain page rendering it, no CDN). */
export function openapiRouter(issuer: string) {
  const router = Router();
  const document = buildOpenApiDocument(`${issuer}/token`);
  router.get('/openapi.json', (_req, res) => { res.json(document); });
  router.get('/docs', (_req, res) => { res.type('html').send(docsPageHtml); });
  router.get('/docs/render.js', (_req, res) => { res.type('text/javascript').send(docsPageScript); });
  return router;
}
