// A private MariaDB instance on loopback: its own data directory, socket and port,
// independent of any system MariaDB. Uses only Node built-ins (runs before npm install).
import { spawn, spawnSync, execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';

const searchPath = ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin'];

function findBinary(name) {
  for (const dir of searchPath) {
    const candidate = join(dir, name);
    if (existsSync(candidate)) return candidate;
  }
  return null;
}

/** Installs Debian's mariadb-server when mariadbd is missing (as root), or stops with a clear message. */
export function ensureMariadbInstalled() {
  if (findBinary('mariadbd')) return;
  if (process.getuid?.() !== 0) {
    console.error('MariaDB is not installed. Install it with: sudo apt-get install mariadb-server   (then run this command again)');
    process.exit(1);
  }
  console.log('Installing MariaDB (Debian package mariadb-server)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', 'mariadb-server'], { stdio: 'inherit', env });
}

export function mariadbPaths(baseDir) {
  return {
    dataDir: join(baseDir, 'data'),
    socket: join(baseDir, 'mariadb.sock'),
    pidFile: join(baseDir, 'mariadb.pid'),
    logFile: join(baseDir, 'mariadb.log'),
    tmpDir: join(baseDir, 'tmp'),
  };
}

function client(socket, sql) {
  const result = spawnSync(findBinary('mariadb'), ['--no-defaults', `--socket=${socket}`, '-u', 'root', '-e', sql], { encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`MariaDB statement failed: ${result.stderr.trim()}`);
  return result.stdout;
}

async function waitForPing(socket, child, logFile) {
  for (let i = 0; i < 150; i++) {
    if (child.exitCode !== null) throw new Error(`mariadbd exited early (code ${child.exitCode}); see ${logFile}`);
    const ping = spawnSync(findBinary('mariadb-admin'), ['--no-defaults', `--socket=${socket}`, '-u', 'root', 'ping'], { encoding: 'utf8' });
    if (ping.status === 0) return;
    await sleep(100);
  }
  throw new Error(`MariaDB did not answer within 15 s; see ${logFile}`);
}

/**
 * Initialises (first run) and starts mariadbd bound to 127.0.0.1:port with data under baseDir.
 * Returns { child, stop() }; stop() shuts the server down cleanly.
 */
export async function startMariadb({ baseDir, port }) {
  const paths = mariadbPaths(baseDir);
  mkdirSync(baseDir, { recursive: true });
  const asRoot = process.getuid?.() === 0;
  if (!existsSync(join(paths.dataDir, 'mysql'))) {
    mkdirSync(paths.dataDir, { recursive: true });
    const init = spawnSync(findBinary('mariadb-install-db'), [
      '--no-defaults', `--datadir=${paths.dataDir}`, ...(asRoot ? ['--user=root'] : []),
      '--auth-root-authentication-method=socket', '--skip-test-db',
    ], { encoding: 'utf8' });
    if (init.status !== 0) throw new Error(`mariadb-install-db failed: ${init.stderr}`);
  }
  // Its own temporary directory: a shared /tmp may be cleaned under a running server.
  mkdirSync(paths.tmpDir, { recursive: true });
  const log = openSync(paths.logFile, 'a');
  // The buffer pool holds a plant's working set (the benchmark's 250k motors and 10M measurements
  // take about 1.1 GB with their indexes), so a scan of an older serial does not wait for the
  // disk; it is allocated as it fills. A restart reloads all of it (dump of every page at shutdown).
  const child = spawn(findBinary('mariadbd'), [
    '--no-defaults', `--datadir=${paths.dataDir}`, `--socket=${paths.socket}`, `--port=${port}`,
    '--bind-address=127.0.0.1', ...(asRoot ? ['--user=root'] : []), '--skip-name-resolve',
    `--pid-file=${paths.pidFile}`, `--log-error=${paths.logFile}`, `--tmpdir=${paths.tmpDir}`,
    '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
    '--innodb-buffer-pool-size=2G', '--innodb-buffer-pool-dump-pct=100', '--max-connections=400',
  ], { stdio: ['ignore', log, log] });
  await waitForPing(paths.socket, child, paths.logFile);
  return {
    child,
    socket: paths.socket,
    sql: (statement) => client(paths.socket, statement),
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once('exit', resolve));
      spawnSync(findBinary('mariadb-admin'), ['--no-defaults', `--socket=${paths.socket}`, '-u', 'root', 'shutdown']);
      await Promise.race([exited, sleep(10_000)]);
      if (child.exitCode === null) child.kill('SIGTERM');
    },
  };
}

/** Creates the database and the application user (password auth, both loopback host names). */
export function ensureDatabase(server, { database, user, password }) {
  const quoted = password.replace(/'/g, "''");
  server.sql([
    `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    ...['127.0.0.1', 'localhost'].flatMap((host) => [
      `CREATE USER IF NOT EXISTS '${user}'@'${host}' IDENTIFIED BY '${quoted}'`,
      `ALTER USER '${user}'@'${host}' IDENTIFIED BY '${quoted}'`,
      `GRANT ALL PRIVILEGES ON \`${database.replace(/_/g, '\\_')}%\`.* TO '${user}'@'${host}'`,
    ]),
    'FLUSH PRIVILEGES',
  ].join(';\n'));
}
