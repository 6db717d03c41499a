import knexFactory, { type Knex } from 'knex';
import type { Config } from '../config.js';

export type Db = Knex;

/** One knex pool for the process. DATETIME values are read and written as UTC. */
export function createDb(db: Config['db']): Knex {
  return knexFactory({
    client: 'mysql2',
    connection: {
      host: db.host, port: db.port, user: db.user, password: db.password, database: db.database,
      charset: 'utf8mb4', timezone: 'Z', dateStrings: false, supportBigNumbers: true, bigNumberStrings: false,
    },
    pool: {
      min: 0,
      max: db.poolMax,
      afterCreate: (conn: { query: (sql: string, cb: (err: Error | null) => void) => void }, done: (err: Error | null, conn: unknown) => void) => {
        conn.query("SET SESSION time_zone = '+00:00', SESSION tx_isolation = 'READ-COMMITTED'", (err) => done(err, conn));
      },
    },
    migrations: { directory: 'migrations', extension: 'ts', loadExtensions: ['.ts'] },
    seeds: { directory: 'seeds', extension: 'ts', loadExtensions: ['.ts'] },
  });
}
