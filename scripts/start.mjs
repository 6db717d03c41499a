// `npm start`: everything from a fresh clone — packages, a private MariaDB, migrations, the demo
// plant (once), the IdP fake, the mail sink, the client build and the app. Ctrl-C stops it all.
// Uses only Node built-ins until the npm packages are installed.
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureNodeModules } from './lib/deps.mjs';
import { ensureMariadbInstalled, startMariadb, ensureDatabase } from './lib/mariadb.mjs';
import { loadOrCreateSecrets } from './lib/secrets.mjs';
import { runNode, runNodeSync, stopChild, waitForHttp } from './lib/children.mjs';
import { appNodeFlags } from './lib/app-node-flags.mjs';
import { defaultAppWorkers } from './lib/app-workers.mjs';

const root = resolve(fileURLToPath(new URL('..', import.meta.url)));
const dev = process.argv.includes('--dev');
const dataDir = join(root, '.data');
const lockFile = join(dataDir, 'fluxtrail.pid');
const ports = {
  db: Number(process.env.FLUXTRAIL_DB_PORT ?? 3307),
  app: Number(process.env.FLUXTRAIL_PORT ?? 3000),
  idp: 3001,
  smtp: 2525,
  mailWeb: 3025,
  vite: 5173,
};

function alreadyRunning() {
  if (!existsSync(lockFile)) return null;
  const pid = Number(readFileSync(lockFile, 'utf8'));
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

const runningPid = alreadyRunning();
if (runningPid) {
  console.error(`Fluxtrail is already running (process ${runningPid}) at http://127.0.0.1:${ports.app}. Stop it with Ctrl-C in its terminal first.`);
  process.exit(1);
}
mkdirSync(dataDir, { recursive: true });
writeFileSync(lockFile, String(process.pid));

const children = [];
let db = null;
let stopping = false;

async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping Fluxtrail…');
  await Promise.all(children.reverse().map((child) => stopChild(child)));
  if (db) await db.stop();
  rmSync(lockFile, { force: true });
  console.log('Stopped.');
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  ensureNodeModules(root);
  ensureMariadbInstalled();
  const secrets = loadOrCreateSecrets(join(dataDir, 'secrets.json'));
  db = await startMariadb({ baseDir: join(dataDir, 'mariadb'), port: ports.db });
  ensureDatabase(db, { database: 'fluxtrail', user: 'fluxtrail', password: secrets.dbPassword });

  const publicUrl = dev ? `http://127.0.0.1:${ports.vite}` : `http://127.0.0.1:${ports.app}`;
  const env = {
    ...process.env,
    FLUXTRAIL_PORT: String(ports.app),
    FLUXTRAIL_PUBLIC_URL: publicUrl,
    FLUXTRAIL_DB_PORT: String(ports.db),
    // MariaDB's Unix socket: less CPU per round trip, on both sides, than TCP on loopback.
    FLUXTRAIL_DB_SOCKET: db.socket,
    FLUXTRAIL_DB_PASSWORD: secrets.dbPassword,
    FLUXTRAIL_DB_NAME: 'fluxtrail',
    FLUXTRAIL_SESSION_SECRET: secrets.sessionSecret,
    FLUXTRAIL_OIDC_ISSUER: `http://127.0.0.1:${ports.idp}`,
    FLUXTRAIL_SMTP_PORT: String(ports.smtp),
    FLUXTRAIL_DATA_DIR: dataDir,
    FLUXTRAIL_STATIC_DIR: join(root, 'dist'),
    FLUXTRAIL_WORKERS: process.env.FLUXTRAIL_WORKERS ?? String(defaultAppWorkers()),
    IDP_PORT: String(ports.idp),
    APP_BASE_URLS: `http://127.0.0.1:${ports.app},http://127.0.0.1:${ports.vite}`,
    MAIL_SMTP_PORT: String(ports.smtp),
    MAIL_WEB_PORT: String(ports.mailWeb),
  };
  runNodeSync(['--import', 'tsx', 'scripts/migrate.ts', '--seed-demo'], { env, cwd: root });
  if (!dev) {
    console.log('Building the client…');
    runNodeSync([join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], { env, cwd: root });
  }
  children.push(runNode(['--import', 'tsx', 'idp-fake/main.ts'], { env, cwd: root, label: 'idp' }));
  children.push(runNode(['--import', 'tsx', 'mail-fake/main.ts'], { env, cwd: root, label: 'mail' }));
  await waitForHttp(`http://127.0.0.1:${ports.idp}/.well-known/openid-configuration`);
  children.push(runNode([...appNodeFlags, '--import', 'tsx', 'server/index.ts'], { env, cwd: root, label: 'app' }));
  if (dev) children.push(runNode([join(root, 'node_modules/vite/bin/vite.js'), '--port', String(ports.vite), '--strictPort'], { env, cwd: root, label: 'vite' }));
  await waitForHttp(`http://127.0.0.1:${ports.app}/api/health`);
  for (const child of children) child.once('exit', (code) => { if (!stopping) { console.error(`A Fluxtrail process exited (code ${code}); stopping.`); void shutdown(1); } });
  console.log(`
Fluxtrail is up:  ${publicUrl}
  identity provider (demo)  http://127.0.0.1:${ports.idp}
  mail inbox (demo)         http://127.0.0.1:${ports.mailWeb}   SMTP 127.0.0.1:${ports.smtp}
  MariaDB (private)         127.0.0.1:${ports.db}, data in .data/mariadb
Demo accounts (password "fluxtrail"): operator, quality, quality2, auditor, manager, admin
Press Ctrl-C to stop.`);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  await shutdown(1);
}
