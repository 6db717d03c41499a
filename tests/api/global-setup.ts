import { startIdp } from '../../idp-fake/index.js';
import { startMailSink } from '../../mail-fake/index.js';
import { createDb } from '../../server/db/knex.js';
import { testConfig } from '../support/test-config.js';
import { resetSchema } from '../support/migrate.js';
import { apiAppUrl, testPorts } from '../support/ports.js';

/** One IdP fake and one mail sink for all API test files; the schema migrated once. */
export default async function setup() {
  const config = testConfig({ database: 'fluxtrail_test', port: testPorts.apiApp, idpPort: testPorts.idp, smtpPort: testPorts.smtp });
  const db = createDb(config.db);
  await resetSchema(db);
  await db.destroy();
  const idp = await startIdp({ port: testPorts.idp, appBaseUrls: [apiAppUrl] });
  const mail = await startMailSink({ smtpPort: testPorts.smtp, webPort: testPorts.mailWeb });
  return async () => {
    await mail.close();
    await idp.close();
  };
}
