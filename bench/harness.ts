import type { Knex } from 'knex';
import { startIdp } from '../idp-fake/index.js';
import { startServer, type RunningServer } from '../server/index.js';
import { loadConfig } from '../server/config.js';

export type BenchContext = {
  db: Knex;
  app: RunningServer;
  idpUrl: string;
  log: (line: string) => void;
  stop(): Promise<void>;
};

const appPort = 3130;
const idpPort = 3131;

/** The real app and IdP fake against the bench database (jobs off so only the measured work runs). */
export async function startBenchApp(log: (line: string) => void): Promise<BenchContext> {
  const idp = await startIdp({ port: idpPort, appBaseUrls: [`http://127.0.0.1:${appPort}`] });
  const config = loadConfig({ ...process.env, FLUXTRAIL_PORT: String(appPort), FLUXTRAIL_PUBLIC_URL: `http://127.0.0.1:${appPort}`, FLUXTRAIL_OIDC_ISSUER: idp.issuer, FLUXTRAIL_STATIC_DIR: '.data/no-static' });
  const app = await startServer({ ...config, jobsEnabled: false });
  await app.db.migrate.latest();
  return {
    db: app.db, app, idpUrl: idp.issuer, log,
    async stop() {
      await app.stop();
      await idp.close();
    },
  };
}

export async function clientToken(idpUrl: string, clientId: string, secret: string, scope: string): Promise<string> {
  const response = await fetch(new URL('/token', idpUrl), {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', authorization: `Basic ${Buffer.from(`${clientId}:${secret}`).toString('base64')}` },
    body: new URLSearchParams({ grant_type: 'client_credentials', scope }).toString(),
  });
  const body = await response.json() as { access_token?: string };
  if (!body.access_token) throw new Error(`no token for ${clientId}`);
  return body.access_token;
}
