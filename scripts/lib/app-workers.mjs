import { availableParallelism } from 'node:os';

// How many app processes `npm start` and the benchmark run (FLUXTRAIL_WORKERS overrides it): one
// per core, less the core that MariaDB on the same machine needs. Measured with the benchmark's
// ingest on 2 cores, 2026-12-02: one process took 1.3-1.7 ms of app CPU per run against 2.1-2.5 ms
// for two (each of two writes batches half the size, and both compete with MariaDB for the same
// cores), and the serial look-up under ingest answered at p95 19-23 ms instead of 26-43 ms.
export function defaultAppWorkers() {
  return Math.max(1, availableParallelism() - 1);
}
