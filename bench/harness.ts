import { spawn, type ChildProcess } from 'node:child_process';
import type { Knex } from 'knex';
import { startIdp } from '../idp-fake/index.js';
import { loadConfig } from '../server/config.js';
import { createDb } from '../server/db/knex.js';
import { appNodeFlags } from '../scripts/lib/app-node-flags.mjs';
import { defaultAppWorkers } from '../scripts/lib/app-workers.mjs';

export type BenchContext = {
  db: Knex;
  app: { url: string };
  idpUrl: string;
  log: (line: string) => void;
  stop(): Promise<void>;
};

// FLUXTRAIL_BENCH_PORT_BASE moves both, so a second checkout can benchmark beside this one.
const appPort = Number(process.env.FLUXTRAIL_BENCH_PORT_BASE ?? 3130);
const idpPort = appPort + 1;

async function waitForHealth(url: string, child: ChildProcess): Promise<void> {
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) throw new Error(`the app exited with code ${child.exitCode}`);
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return;
    } catch { /* not listening yet */ }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the app did not answer /api/health within 60 s');
}

/**
 * The real app as it runs in production — as many processes as `npm start` runs (FLUXTRAIL_WORKERS,
 * default one per core less MariaDB's) — and the IdP fake, against the bench database. Jobs are off so only the measured
 * work runs. The bench's own queries use a connection pool of their own.
 */
export async function startBenchApp(log: (line: string) => void): Promise<BenchContext> {
  const idp = await startIdp({ port: idpPort, appBaseUrls: [`http://127.0.0.1:${appPort}`] });
  const env = {
    ...process.env, FLUXTRAIL_PORT: String(appPort), FLUXTRAIL_PUBLIC_URL: `http://127.0.0.1:${appPort}`,
    FLUXTRAIL_OIDC_ISSUER: idp.issuer, FLUXTRAIL_STATIC_DIR: '.data/no-static', FLUXTRAIL_JOBS: 'off',
    FLUXTRAIL_WORKERS: process.env.FLUXTRAIL_WORKERS ?? String(defaultAppWorkers()),
  };
  const db = createDb(loadConfig(env).db);
  await db.migrate.latest();
  // FLUXTRAIL_BENCH_NODE_ARGS adds flags to the app's processes, e.g. "--cpu-prof --cpu-prof-dir=.data/prof".
  const nodeArgs = (process.env.FLUXTRAIL_BENCH_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const child = spawn(process.execPath, [...appNodeFlags, ...nodeArgs, '--import', 'tsx', 'server/index.ts'], { env, stdio: ['ignore', 'ignore', 'inherit'] });
  const url = `http://127.0.0.1:${appPort}`;
  await waitForHealth(url, child);
  return {
    db, app: { url }, idpUrl: idp.issuer, log,
    async stop() {
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
      await db.destroy();
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
