import { startServer, type RunningServer } from '../../server/index.js';
import { testConfig } from './test-config.js';
import { testPorts } from './ports.js';
import { truncateAll } from './migrate.js';

/** The real Fluxtrail server on the API test port, against the migrated test database. */
export async function startApiServer(overrides: Partial<{ smtpPort: number }> = {}): Promise<RunningServer> {
  const config = testConfig({
    database: 'fluxtrail_test', port: testPorts.apiApp, idpPort: testPorts.idp,
    smtpPort: overrides.smtpPort ?? testPorts.smtp,
  });
  const server = await startServer({ ...config, jobsEnabled: false });
  await truncateAll(server.db);
  return server;
}
