import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { loadConfig, ConfigError, type Config } from './config.js';
import { createDb } from './db/knex.js';
import { buildApp } from './app.js';
import { startJobs } from './jobs/start-jobs.js';
import { startMailOutbox } from './jobs/mail-outbox.js';
import { stopUploadPasses } from './services/uploads/finish-upload-pass.js';
import type { Knex } from 'knex';
import cluster from 'node:cluster';
import { runWorkers } from './workers.js';

export type RunningServer = { server: Server; db: Knex; config: Config; url: string; stop(): Promise<void> };

/** Starts the HTTP server; port 0 picks a free port (tests). */
export async function startServer(config: Config = loadConfig()): Promise<RunningServer> {
  const db = createDb(config.db);
  const app = buildApp({ config, db });
  // Express 5 hands a listen error (a port taken) to the callback.
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, (error?: Error) => (error ? reject(error) : resolve(s)));
  });
  const { port } = server.address() as AddressInfo;
  const jobs = config.jobsEnabled ? startJobs({ db, config }) : undefined;
  const mailOutbox = config.jobsEnabled ? startMailOutbox({ db, config }) : undefined;
  return {
    server, db, config, url: `http://${config.host}:${port}`,
    async stop() {
      await stopUploadPasses();
      await jobs?.stop();
      await mailOutbox?.stop();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await db.destroy();
    },
  };
}

/** Runs one server in this process until SIGTERM/SIGINT. */
async function serveUntilStopped(config: Config) {
  const running = await startServer(config);
  console.log(`Fluxtrail API and app on ${running.config.publicUrl} (process ${process.pid})`);
  // Once: under a terminal a worker gets SIGINT from it and SIGTERM from the primary.
  let stopping: Promise<void> | undefined;
  const shutdown = () => { stopping ??= running.stop().then(() => process.exit(0)); };
  process.on('SIGTERM', shutdown);
  process.on('SIGINT', shutdown);
}

const isMain = import.meta.url === `file://${process.argv[1]}`;
if (isMain) {
  try {
    const config = loadConfig();
    // Even a single app process runs under the cluster's primary, which replaces it should it die.
    if (cluster.isPrimary) {
      runWorkers(config.workers);
    } else {
      await serveUntilStopped(config);
    }
  } catch (error) {
    if (error instanceof ConfigError) {
      console.error(error.message);
      process.exit(2);
    }
    throw error;
  }
}
