import { Router } from 'express';
import type { Knex } from 'knex';

/** Liveness with a real database round trip (bounded, so a hung database answers 503 quickly). */
export function healthRouter(db: Knex) {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await Promise.race([
        db.raw('SELECT 1'),
        new Promise((_, reject) => setTimeout(() => reject(new Error('database check timed out')), 2000).unref()),
      ]);
      res.json({ status: 'ok', db: 'ok' });
    } catch {
      res.status(503).json({ status: 'degraded', db: 'down' });
    }
  });
  return router;
}
