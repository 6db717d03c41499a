import { loadConfig } from './server/config.js';

// For knex's CLI (`node --import tsx node_modules/knex/bin/cli.js migrate:latest`).
const { db } = loadConfig();

export default {
  client: 'mysql2',
  connection: { host: db.host, port: db.port, user: db.user, password: db.password, database: db.database, charset: 'utf8mb4', timezone: 'Z' },
  migrations: { directory: './migrations', extension: 'ts', loadExtensions: ['.ts'] },
  seeds: { directory: './seeds', extension: 'ts', loadExtensions: ['.ts'] },
};
