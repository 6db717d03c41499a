import knexFactory, { type Knex } from 'knex';
import type { Config } from '../config.js';

export type Db = Knex;

function knexOptions(db: Config['db'], options: { multipleStatements: boolean; poolMax: number }): Knex.Config {
  return {
    client: 'mysql2',
    connection: {
      // A Unix socket, where MariaDB runs on this machine, costs both sides less CPU per round trip than TCP.
      ...(db.socketPath ? { socketPath: db.socketPath } : { host: db.host, port: db.port }), user: db.user, password: db.password, database: db.database,
      charset: 'utf8mb4', timezone: 'Z', dateStrings: false, supportBigNumbers: true, bigNumberStrings: false,
      multipleStatements: options.multipleStatements,
    },
    pool: {
      min: 0,
      max: options.poolMax,
      afterCreate: (conn: { query: (sql: string, cb: (err: Error | null) => void) => void }, done: (err: Error | null, conn: unknown) => void) => {
        conn.query("SET SESSION time_zone = '+00:00', SESSION tx_isolation = 'READ-COMMITTED'", (err) => done(err, conn));
      },
    },
    migrations: { directory: 'migrations', extension: 'ts', loadExtensions: ['.ts'] },
    seeds: { directory: 'seeds', extension: 'ts', loadExtensions: ['.ts'] },
  };
}

const statementPools = new WeakMap<Knex, () => Knex>();

/**
 * One knex pool for the process. DATETIME values are read and written as UTC. Beside it, created on
 * first use and closed with it, a small pool whose connections accept several statements per round
 * trip (statementPool), for the two paths that must stay fast under load: the ingest writer and the
 * motor record read; they send only statements built by knex. Every other query keeps one
 * statement per call, so a mistake elsewhere can never chain statements.
 */
export function createDb(db: Config['db']): Knex {
  const knex = knexFactory(knexOptions(db, { multipleStatements: false, poolMax: db.poolMax }));
  let statements: Knex | undefined;
  statementPools.set(knex, () => (statements ??= knexFactory(knexOptions(db, { multipleStatements: true, poolMax: 8 }))));
  // Closing the app's pool closes this one too (knex defines destroy as a configurable property).
  const destroy = knex.destroy.bind(knex);
  Object.defineProperty(knex, 'destroy', {
    configurable: true,
    value: async () => {
      await statements?.destroy();
      return destroy();
    },
  });
  return knex;
}

/** The multi-statement pool beside a pool made by createDb (undefined for any other knex). */
export function statementPool(db: Knex): Knex | undefined {
  return statementPools.get(db)?.();
}
