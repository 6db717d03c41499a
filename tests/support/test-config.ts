import { loadConfig, type Config } from '../../server/config.js';

/** Configuration for a real Fluxtrail server against the throw-away test MariaDB. */
export function testConfig(overrides: { database: string; port: number; idpPort: number; smtpPort: number; staticDir?: string }): Config {
  const env = process.env;
  if (!env.FLUXTRAIL_TEST_DB_PASSWORD) throw new Error('Run the tests with `npm test` (it starts the throw-away MariaDB).');
  return loadConfig({
    FLUXTRAIL_PORT: String(overrides.port),
    FLUXTRAIL_PUBLIC_URL: `http://127.0.0.1:${overrides.port}`,
    FLUXTRAIL_DB_HOST: env.FLUXTRAIL_TEST_DB_HOST,
    FLUXTRAIL_DB_PORT: env.FLUXTRAIL_TEST_DB_PORT,
    FLUXTRAIL_DB_SOCKET: env.FLUXTRAIL_TEST_DB_SOCKET,
    FLUXTRAIL_DB_USER: env.FLUXTRAIL_TEST_DB_USER,
    FLUXTRAIL_DB_PASSWORD: env.FLUXTRAIL_TEST_DB_PASSWORD,
    FLUXTRAIL_DB_NAME: overrides.database,
    FLUXTRAIL_OIDC_ISSUER: `http://127.0.0.1:${overrides.idpPort}`,
    FLUXTRAIL_SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
    FLUXTRAIL_SMTP_PORT: String(overrides.smtpPort),
    FLUXTRAIL_DATA_DIR: `.data/test-${overrides.database}`,
    FLUXTRAIL_STATIC_DIR: overrides.staticDir ?? '.data/no-static',
    FLUXTRAIL_LOGIN_RATE_LIMIT: '1000',
  });
}
