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

  it('when MariaDB is unreachable, then it answers 503 with db down', async () => {
    const deadConfig = { ...server.config, db: { ...server.config.db, port: 1 } };
    const deadDb = createDb(deadConfig.db);
    try {
      const response = await request(buildApp({ config: deadConfig, db: deadDb })).get('/api/health');
      expect(response.status).toBe(503);
      expect(response.body.db).toBe('down');
    } finally {
      await deadDb.destroy();
    }
  });
});
