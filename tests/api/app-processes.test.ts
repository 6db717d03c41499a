import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { createServer, type Server } from 'node:net';
import type { AddressInfo } from 'node:net';

// `node server/index.ts` as `npm start` runs it: a cluster primary over the app's processes. A
// process that dies before it listens would die again; the primary must then stop and report.

function occupiedPort(): Promise<Server> {
  return new Promise((resolve) => {
    const blocker = createServer();
    blocker.listen(0, '127.0.0.1', () => resolve(blocker));
  });
}

function runApp(env: Record<string, string>): Promise<{ code: number | null; stderr: string; ms: number }> {
  const started = performance.now();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env, FLUXTRAIL_DB_PASSWORD: 'not-used-before-listening', FLUXTRAIL_SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
      FLUXTRAIL_JOBS: 'off', FLUXTRAIL_STATIC_DIR: '.data/no-static', ...env,
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => { stderr += chunk.toString(); });
  const timer = setTimeout(() => child.kill('SIGKILL'), 60_000);
  return new Promise((resolve) => child.once('close', (code) => {
    clearTimeout(timer);
    resolve({ code, stderr, ms: performance.now() - started });
  }));
}

describe('app processes', () => {
  it('when the app process cannot listen because its port is taken, then the primary stops with an error instead of starting it again and again', async () => {
    const blocker = await occupiedPort();
    try {
      const { port } = blocker.address() as AddressInfo;
      const outcome = await runApp({ FLUXTRAIL_PORT: String(port), FLUXTRAIL_WORKERS: '1' });
      expect(outcome.code).not.toBe(0);
      expect(outcome.code).not.toBeNull(); // not killed by the test's timeout
      expect(outcome.stderr).toContain('EADDRINUSE');
      expect(outcome.stderr).toContain('before it listened; stopping');
      expect(outcome.stderr).not.toContain('starting another');
    } finally {
      blocker.close();
    }
  }, 70_000);
});
