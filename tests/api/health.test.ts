import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import type { RunningServer } from '../../server/index.js';
import { buildApp } from '../../server/app.js';
import { createDb } from '../../server/db/knex.js';

describe('GET /api/health', () => {
  let server: RunningServer;
  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });

  it('when MariaDB answers, then it reports ok', async () => {
    const response = await request(server.url).get('/api/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('when MariaDB is unreachable, over TCP or its socket, then it answers 503 with db down', async () => {
    for (const unreachable of [{ socketPath: undefined, port: 1 }, { socketPath: '/nonexistent/mariadb.sock' }]) {
      const deadConfig = { ...server.config, db: { ...server.config.db, ...unreachable } };
      const deadDb = createDb(deadConfig.db);
      try {
        const response = await request(buildApp({ config: deadConfig, db: deadDb })).get('/api/health');
        expect(response.status).toBe(503);
        expect(response.body.db).toBe('down');
      } finally {
        await deadDb.destroy();
      }
    }
  });
});
