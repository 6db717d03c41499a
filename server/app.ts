import express from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Knex } from 'knex';
import type { Config } from './config.js';
import { createOidc } from './auth/oidc.js';
import { createBearerVerifier } from './auth/bearer.js';
import { sessionMiddleware } from './auth/session.js';
import { resolvePrincipal } from './auth/principal.js';
import { csrfProtection } from './auth/csrf.js';
import { authRouter } from './routes/auth.js';
import { apiRouter } from './routes/index.js';
import { errorHandler, notFoundHandler } from './middleware/error-handler.js';

export type AppDeps = { config: Config; db: Knex };

/** Builds the Express app (no listening), so tests can run the real server on port 0. */
export function buildApp({ config, db }: AppDeps) {
  const app = express();
  const oidc = createOidc(config);
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');
  app.use(helmet({
    contentSecurityPolicy: {
      directives: {
        'default-src': ["'self'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'style-src': ["'self'", "'unsafe-inline'"],
        'media-src': ["'self'", 'blob:'],
        'connect-src': ["'self'"],
        'upgrade-insecure-requests': null,
      },
    },
    strictTransportSecurity: config.publicUrl.startsWith('https://'),
  }));
  const sessions = sessionMiddleware(db, config.sessionSecret, config.publicUrl.startsWith('https://'));
  // A bearer-token call (a station, an integration) is never a browser session: no session work.
  app.use((req, res, next) => (req.get('authorization') ? next() : sessions(req, res, next)));
  app.use('/auth', authRouter(config, db, oidc));
  app.use('/api', resolvePrincipal(createBearerVerifier(config, oidc)), csrfProtection([new URL(config.publicUrl).origin]));
  app.use('/api', apiRouter({ config, db }));
  app.use('/api', notFoundHandler);
  serveClient(app, config.staticDir);
  app.use(errorHandler);
  return app;
}

/** The built single-page app, with every unknown non-API path answered by index.html. */
function serveClient(app: express.Express, staticDir: string) {
  const root = resolve(staticDir);
  if (!existsSync(root)) return;
  app.use(express.static(root, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root, maxAge: 0 }));
}
