// `npm test`: installs what is missing, starts a throw-away MariaDB (temporary data directory,
// port 3308) that never touches demo data, builds the client for the browser tests, runs Vitest.
// Extra arguments are passed to Vitest (e.g. `npm test -- --project unit`).
import { mkdtempSync, mkdirSync, rmSync } from 'node:fs';
import { spawn } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { randomBytes } from 'node:crypto';
import { ensureNodeModules, ensureDebianPackage } from './lib/deps.mjs';
import { ensureMariadbInstalled, startMariadb, ensureDatabase } from './lib/mariadb.mjs';
import { runNodeSync } from './lib/children.mjs';

const root = resolve(fileURLToPath(new URL('..', import.meta.url)));
const vitestArgs = process.argv.slice(2);
const port = Number(process.env.FLUXTRAIL_TEST_DB_PORT ?? 3308);

ensureNodeModules(root);
ensureMariadbInstalled();
ensureDebianPackage('/usr/bin/chromium', 'chromium');
// The evidence-pack tests open generated workbooks with LibreOffice, a reader independent of exceljs.
ensureDebianPackage('/usr/bin/libreoffice', 'libreoffice-calc-nogui', { withRecommends: false });

const baseDir = mkdtempSync(join(tmpdir(), 'fluxtrail-test-db-'));
const password = randomBytes(12).toString('base64url');
let db;
let code = 1;
try {
  db = await startMariadb({ baseDir, port });
  for (const database of ['fluxtrail_test', 'fluxtrail_test_browser']) {
    ensureDatabase(db, { database, user: 'fluxtrail_test', password });
  }
  const env = {
    ...process.env,
    FLUXTRAIL_TEST_DB_HOST: '127.0.0.1',
    FLUXTRAIL_TEST_DB_PORT: String(port),
    // Over MariaDB's Unix socket, as `npm start` and the benchmark connect.
    FLUXTRAIL_TEST_DB_SOCKET: db.socket,
    FLUXTRAIL_TEST_DB_USER: 'fluxtrail_test',
    FLUXTRAIL_TEST_DB_PASSWORD: password,
    FLUXTRAIL_TEST_DIST: join(root, '.data', 'test-dist'),
  };
  const runsBrowser = vitestArgs.length === 0 || vitestArgs.some((a) => a.includes('browser'));
  if (runsBrowser) {
    console.log('Building the client for the browser tests…');
    runNodeSync([join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn', '--outDir', env.FLUXTRAIL_TEST_DIST, '--emptyOutDir'], { env, cwd: root });
  }
  mkdirSync(join(root, '.data'), { recursive: true });
  code = await new Promise((resolveCode) => {
    const child = spawn(process.execPath, ['--import', 'tsx',
      join(root, 'node_modules/vitest/vitest.mjs'), 'run',
      '--reporter=default', '--reporter=json', `--outputFile.json=${join(root, '.data', 'test-report.json')}`,
      ...vitestArgs,
    ], { cwd: root, env, stdio: 'inherit' });
    child.on('exit', (exitCode) => resolveCode(exitCode ?? 1));
    for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
  });
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
} finally {
  if (db) await db.stop();
  rmSync(baseDir, { recursive: true, force: true });
}
process.exit(code);
