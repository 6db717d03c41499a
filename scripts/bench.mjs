// `npm run bench`: a plant-scale benchmark in its own MariaDB (data kept in .data/bench-mariadb so
// the generated set is reused by the next run). Prints the figures and writes bench/results/latest.json.
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureNodeModules } from './lib/deps.mjs';
import { ensureMariadbInstalled, startMariadb, ensureDatabase } from './lib/mariadb.mjs';
import { loadOrCreateSecrets } from './lib/secrets.mjs';
import { runNodeSync } from './lib/children.mjs';
import { appNodeFlags } from './lib/app-node-flags.mjs';

const root = resolve(fileURLToPath(new URL('..', import.meta.url)));
const port = Number(process.env.FLUXTRAIL_BENCH_DB_PORT ?? 3309);
// One benchmark at a time: two would share (and shut down) the same MariaDB data directory.
const lockFile = join(root, '.data', 'bench.pid');
if (existsSync(lockFile)) {
  const pid = Number(readFileSync(lockFile, 'utf8'));
  let alive = false;
  try { process.kill(pid, 0); alive = true; } catch { /* stale lock */ }
  if (alive) {
    console.error(`A benchmark is already running (process ${pid}); wait for it to finish.`);
    process.exit(1);
  }
}
mkdirSync(join(root, '.data'), { recursive: true });
writeFileSync(lockFile, String(process.pid));
ensureNodeModules(root);
ensureMariadbInstalled();
const secrets = loadOrCreateSecrets(join(root, '.data', 'secrets.json'));
// Every run adds the motors it posts (a full run about 20k), so figures would drift away from the
// stated scale: past this bound the set is dropped and generated afresh (a few minutes). The
// control-chart section's top-up runs are not counted: it adds them only up to its own target.
const grownBoundMotors = 300_000;
/** The one value a query prints (the client prints a header line above it). */
const scalar = (server, sql) => server.sql(sql).trim().split('\n').at(-1);
function rebuildIfGrown(server) {
  if (scalar(server, "SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = 'fluxtrail_bench' AND table_name = 'motors'") !== '1') return;
  const motors = Number(scalar(server, 'SELECT COUNT(*) FROM fluxtrail_bench.motors'));
  if (!(motors > grownBoundMotors)) return; // an unreadable count drops nothing
  console.log(`[bench] the set has grown to ${motors} motors through earlier runs: generating it afresh…`);
  server.sql('DROP DATABASE fluxtrail_bench');
}

const db = await startMariadb({ baseDir: join(root, '.data', 'bench-mariadb'), port });
let code = 0;
try {
  rebuildIfGrown(db);
  ensureDatabase(db, { database: 'fluxtrail_bench', user: 'fluxtrail', password: secrets.dbPassword });
  // The benchmark's processes run with the app's flags: its evidence section builds the pack as the
  // app's job runner does (bench/evidence-process.ts, started with the same flags). FLUXTRAIL_BENCH_SELF_ARGS adds more, e.g. "--cpu-prof --cpu-prof-dir=.data/prof".
  const selfArgs = [...appNodeFlags, ...(process.env.FLUXTRAIL_BENCH_SELF_ARGS ?? '').split(' ').filter(Boolean)];
  runNodeSync([...selfArgs, '--import', 'tsx', 'bench/run.ts', ...process.argv.slice(2)], {
    cwd: root,
    env: {
      ...process.env,
      FLUXTRAIL_DB_PORT: String(port), FLUXTRAIL_DB_SOCKET: db.socket, FLUXTRAIL_DB_NAME: 'fluxtrail_bench', FLUXTRAIL_DB_PASSWORD: secrets.dbPassword,
      FLUXTRAIL_SESSION_SECRET: secrets.sessionSecret, FLUXTRAIL_DB_POOL_MAX: '40',
    },
  });
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  code = 1;
} finally {
  await db.stop();
  rmSync(lockFile, { force: true });
}
process.exit(code);
