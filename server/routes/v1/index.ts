import { Router } from 'express';
import type { Knex } from 'knex';
import { productsRouter } from './products.js';
import { stationsMeRouter } from './stations-me.js';
import { testRunsRouter } from './test-runs.js';
import { motorsRouter } from './motors.js';
import { holdsRouter, lotsRouter } from './lots.js';
import { motorWaveformsRouter } from './motor-waveforms.js';
import type { BlobStore } from '../../blob-store/blob-store.js';

/** The versioned plant-record API, mounted at /api/v1. */
export function v1Router(db: Knex, blobs: BlobStore) {
  const router = Router();
  router.use('/products', productsRouter(db));
  router.use('/stations/me', stationsMeRouter(db));
  router.use('/test-runs', testRunsRouter(db, blobs));
  router.use('/motors', motorWaveformsRouter(db, blobs));
  router.use('/motors', motorsRouter(db));
  router.use('/lots', lotsRouter(db));
  router.use('/holds', holdsRouter(db));
  return router;
}
