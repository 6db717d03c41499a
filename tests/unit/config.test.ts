import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config.js';

const minimal = { FLUXTRAIL_DB_PASSWORD: 'secret', FLUXTRAIL_SESSION_SECRET: 'x'.repeat(32) };

describe('loadConfig', () => {
  it('when only the secrets are given, then the documented defaults apply', () => {
    const config = loadConfig(minimal);
    expect(config.port).toBe(3000);
    expect(config.db.port).toBe(3307);
    expect(config.oidc.issuer).toBe('http://127.0.0.1:3001');
    expect(config.oidc.apiAudience).toBe('urn:fluxtrail:api');
  });

  it('when MariaDB\'s Unix socket is given, then the app connects through it instead of host and port', () => {
    expect(loadConfig(minimal).db.socketPath).toBeUndefined();
    const config = loadConfig({ ...minimal, FLUXTRAIL_DB_SOCKET: '/run/fluxtrail/mariadb.sock' });
    expect(config.db.socketPath).toBe('/run/fluxtrail/mariadb.sock');
    expect(() => loadConfig({ ...minimal, FLUXTRAIL_DB_SOCKET: '' })).toThrow(/FLUXTRAIL_DB_SOCKET/);
  });

  it('when the port is not a number, then start-up stops naming the variable', () => {
    expect(() => loadConfig({ ...minimal, FLUXTRAIL_PORT: 'eighty' })).toThrow(/FLUXTRAIL_PORT/);
  });

  it('when the session secret is short, then start-up stops naming it', () => {
    expect(() => loadConfig({ ...minimal, FLUXTRAIL_SESSION_SECRET: 'short' })).toThrow(ConfigError);
    expect(() => loadConfig({ ...minimal, FLUXTRAIL_SESSION_SECRET: 'short' })).toThrow(/FLUXTRAIL_SESSION_SECRET/);
  });

  it('when the database password is missing, then start-up stops naming it', () => {
    expect(() => loadConfig({ FLUXTRAIL_SESSION_SECRET: 'x'.repeat(32) })).toThrow(/FLUXTRAIL_DB_PASSWORD/);
  });

  it('when the issuer is not a URL, then start-up stops naming it', () => {
    expect(() => loadConfig({ ...minimal, FLUXTRAIL_OIDC_ISSUER: 'not a url' })).toThrow(/FLUXTRAIL_OIDC_ISSUER/);
  });
});
