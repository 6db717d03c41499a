import { Router } from 'express';
import type { Knex } from 'knex';
import { limitSetsRouter, productLimitSetsRouter } from './limit-sets.js';
import { productsRouter } from './products.js';
import { stationClientsRouter } from './station-clients.js';
import { stationsRouter } from './stations.js';

/** Everything under /api/v1/setup. */
export function setupRouter(db: Knex) {
  const router = Router();
  router.use('/products/:code/limit-sets', productLimitSetsRouter(db));
  router.use('/products', productsRouter(db));
  router.use('/limit-sets', limitSetsRouter(db));
  router.use('/stations', stationsRouter(db));
  router.use('/station-clients', stationClientsRouter(db));
  return router;
}
