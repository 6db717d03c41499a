import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import type { RunningServer } from '../../server/index.js';
import { statementPool } from '../../server/db/knex.js';
import { directTransaction } from '../../server/db/direct-transaction.js';
import type { Statement } from '../../server/db/statements.js';
import { jsonValue } from '../../server/db/sql-literals.js';

// The ingest writer's transaction is driven by hand on the multi-statement pool: START
// TRANSACTION rides with the first statements, COMMIT with the last. It must be all or nothing.

const insert = (key: string): Statement => ({ sql: 'INSERT INTO app_meta (meta_key, meta_value, updated_at) VALUES (?, ?, ?)', bindings: [key, 'v', new Date()] });

describe('a transaction driven by hand on the multi-statement pool', () => {
  let server: RunningServer;
  let pool: Knex;
  const keys = async () => (await server.db('app_meta').where('meta_key', 'like', 'probe-%').orderBy('meta_key').pluck('meta_key'));

  beforeAll(async () => {
    server = await startApiServer();
    pool = statementPool(server.db)!;
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => { await truncateAll(server.db); });

  it('when the work sends its statements in several round trips, then all of them are kept together', async () => {
    const rows = await directTransaction(pool, async (send) => {
      await send([insert('probe-1')]);
      // Not visible to another connection before COMMIT.
      expect(await keys()).toEqual([]);
      await send([insert('probe-2'), { sql: 'SELECT COUNT(*) AS n FROM app_meta WHERE meta_key LIKE ?', bindings: ['probe-%'] }], { last: true });
      return 'done';
    });
    expect(rows).toBe('done');
    expect(await keys()).toEqual(['probe-1', 'probe-2']);
  });

  it('when the work throws after statements were sent, then none of them is kept', async () => {
    await expect(directTransaction(pool, async (send) => {
      await send([insert('probe-1')]);
      throw new Error('checked and refused');
    })).rejects.toThrow('checked and refused');
    expect(await keys()).toEqual([]);
  });

  it('when a statement fails in the last round trip, then the COMMIT after it does not run and nothing is kept', async () => {
    await expect(directTransaction(pool, async (send) => {
      await send([insert('probe-1')]);
      await send([insert('probe-2'), insert('probe-1')], { last: true }); // duplicate key
    })).rejects.toMatchObject({ code: 'ER_DUP_ENTRY' });
    expect(await keys()).toEqual([]);
  });

  it('when a binding is undefined, then the statement is refused before it is sent (the driver would write NULL)', async () => {
    const broken: Statement = { sql: 'INSERT INTO app_meta (meta_key, meta_value, updated_at) VALUES (?, ?, ?)', bindings: ['probe-1', undefined, new Date()] };
    await expect(directTransaction(pool, (send) => send([broken], { last: true }))).rejects.toThrow(/undefined binding/);
    expect(await keys()).toEqual([]);
  });

  it('when a JSON value is bound as its own SQL text, then MariaDB reads back the JSON text, and the placeholders after it still bind', async () => {
    // The stored answer of each run is written this way (jsonValue); the reference is JSON.stringify read back unchanged.
    const values = [
      { note: "it's a \\ \"quoted\" ? line\nbreak", unit: 'µV', emoji: '😀', nul: '\u0000', ctrlZ: '\u001a', tab: '\t' },
      ['?', "'", '\\', "\\'", '--', '/*', '#'],
      { results: Array.from({ length: 40 }, (_, i) => ({ characteristic: `c${i}`, value: i / 7, lsl: null, verdict: 'pass' })) },
    ];
    const rows = await directTransaction(pool, (send) => send(values.map((value) => ({ sql: 'SELECT ? AS json, ? AS after', bindings: [jsonValue(value), 'bound?'] })), { last: true })) as Array<Array<{ json: string; after: string }>>;
    expect(rows.map(([row]) => row.json)).toEqual(values.map((value) => JSON.stringify(value)));
    expect(rows.map(([row]) => row.after)).toEqual(values.map(() => 'bound?'));
  });
});
