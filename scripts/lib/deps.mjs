// Bootstrapping helpers that run before node_modules exists: Node built-ins only.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** Installs npm packages when node_modules is missing or older than package-lock.json / package.json. */
export function ensureNodeModules(root) {
  const marker = join(root, 'node_modules', '.package-lock.json');
  const lock = join(root, 'package-lock.json');
  const manifest = join(root, 'package.json');
  const stale = !existsSync(marker)
    || statSync(manifest).mtimeMs > statSync(marker).mtimeMs
    || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs);
  if (!stale) return;
  console.log('Installing npm packages…');
  const args = existsSync(lock) ? ['ci', '--no-audit', '--no-fund'] : ['install', '--no-audit', '--no-fund'];
  execFileSync('npm', args, { cwd: root, stdio: 'inherit' });
}

/**
 * Installs a Debian package when a binary it provides is missing (as root), or stops with a message.
 * `withRecommends: false` keeps large suites (LibreOffice) to what the binary needs.
 */
export function ensureDebianPackage(binary, pkg, { withRecommends = true } = {}) {
  if (existsSync(binary)) return;
  if (process.getuid?.() !== 0) {
    console.error(`${binary} is missing. Install it with: sudo apt-get install ${pkg}`);
    process.exit(1);
  }
  console.log(`Installing ${pkg} (Debian)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const update = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  if (update.status !== 0) throw new Error('apt-get update failed');
  execFileSync('apt-get', ['install', '-y', '-qq', ...(withRecommends ? [] : ['--no-install-recommends']), pkg], { stdio: 'inherit', env });
}
