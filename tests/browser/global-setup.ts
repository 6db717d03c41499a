import type { TestProject } from 'vitest/node';
import { existsSync, readdirSync } from 'node:fs';
import { startIdp } from '../../idp-fake/index.js';
import { startMailSink } from '../../mail-fake/index.js';
import { startServer } from '../../server/index.js';
import { createDb } from '../../server/db/knex.js';
import { testConfig } from '../support/test-config.js';
import { resetSchema } from '../support/migrate.js';
import { testPorts } from '../support/ports.js';

/**
 * The whole product for the browser tests: a fresh database with a small demo plant, the IdP fake,
 * the mail sink and the real app serving the client built by `npm test` (FLUXTRAIL_TEST_DIST).
 */
export default async function setup(project: TestProject) {
  const appUrl = `http://127.0.0.1:${testPorts.browserApp}`;
  const config = testConfig({
    database: 'fluxtrail_test_browser', port: testPorts.browserApp, idpPort: testPorts.browserIdp,
    smtpPort: testPorts.browserSmtp, staticDir: process.env.FLUXTRAIL_TEST_DIST,
  });
  const db = createDb(config.db);
  await resetSchema(db);
  process.env.FLUXTRAIL_DEMO_MOTORS ??= '600';
  process.env.FLUXTRAIL_DATA_DIR = config.dataDir; // the seed writes waveform samples where this app reads them
  if (existsSync('seeds') && readdirSync('seeds').some((f) => f.endsWith('.ts'))) await db.seed.run();
  await db.destroy();
  const idp = await startIdp({ port: testPorts.browserIdp, appBaseUrls: [appUrl] });
  const mail = await startMailSink({ smtpPort: testPorts.browserSmtp, webPort: testPorts.browserMailWeb });
  const app = await startServer(config);
  project.provide('appUrl', appUrl);
  project.provide('mailApiUrl', `http://127.0.0.1:${testPorts.browserMailWeb}/api/messages`);
  return async () => {
    await app.stop();
    await mail.close();
    await idp.close();
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    appUrl: string;
    mailApiUrl: string;
  }
}
