import { defineConfig } from 'vitest/config';

// Three projects: pure unit tests, API tests against a real MariaDB, and browser tests in Chromium.
// scripts/test.mjs starts the throw-away MariaDB and passes its coordinates through the environment.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/api/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
          execArgv: ['--import', 'tsx'],
        },
      },
      {
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          // A sign-in is several redirects and a page load: on a busy 2-core machine that can take
          // longer than expect.poll's default second.
          expect: { poll: { timeout: 15_000 } },
          globalSetup: ['tests/browser/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 180_000,
          execArgv: ['--import', 'tsx'],
        },
      },
    ],
  },
});
