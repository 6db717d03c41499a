import type { Knex } from 'knex';
import type { Statement } from './statements.js';

type Connection = {
  query(sql: string, callback: (error: Error | null, results: unknown) => void): void;
  format(sql: string, values: readonly unknown[]): string;
};

/** An undefined binding would be written as NULL by the driver; knex refuses it, and so do we. */
function assertBound(statements: readonly Statement[]): void {
  for (const statement of statements) {
    if (statement.bindings.some((binding) => binding === undefined)) throw new Error(`undefined binding in: ${statement.sql.slice(0, 120)}`);
  }
}

/** Sends statements to a raw connection of a multi-statement pool; resolves with each one's result. */
function query(connection: Connection, statements: readonly Statement[]): Promise<unknown[]> {
  assertBound(statements);
  return new Promise((resolve, reject) => {
    // Each statement's values are put in by the driver's own formatting, statement by statement:
    // given all values at once, it would scan the whole text for placeholders, and an ingest
    // batch's measurements statement is long and has none.
    const sql = statements.map((s) => (s.bindings.length === 0 ? s.sql : connection.format(s.sql, s.bindings))).join(';\n');
    connection.query(sql, (error, results) => {
      if (error) reject(error);
      else resolve(statements.length === 1 ? [results] : results as unknown[]);
    });
  });
}

const start: Statement = { sql: 'START TRANSACTION', bindings: [] };
const commit: Statement = { sql: 'COMMIT', bindings: [] };
const rollback: Statement = { sql: 'ROLLBACK', bindings: [] };

export type SendStatements = (statements: readonly Statement[], options?: { last?: boolean }) => Promise<unknown[]>;

/**
 * A transaction on one connection of a multi-statement pool (statementPool), driven by hand so
 * that START TRANSACTION travels with the first statements and COMMIT with the last (`last: true`):
 * knex's own transaction costs a round trip each for BEGIN and COMMIT, and on a busy server a round
 * trip costs more than the statements. Rolled back if `work` throws; committed after it if no
 * statement was sent as the last.
 */
export async function directTransaction<T>(pool: Knex, work: (send: SendStatements) => Promise<T>): Promise<T> {
  const connection = await pool.client.acquireConnection() as Connection;
  let open = false;
  const send: SendStatements = async (statements, options = {}) => {
    const leading = open ? [] : [start];
    const trailing = options.last ? [commit] : [];
    open = true;
    const results = await query(connection, [...leading, ...statements, ...trailing]);
    if (options.last) open = false;
    return results.slice(leading.length, leading.length + statements.length);
  };
  try {
    const value = await work(send);
    if (open) await query(connection, [commit]);
    return value;
  } catch (error) {
    // A statement that failed stops the rest of its round trip; the transaction is still open.
    await query(connection, [rollback]).catch(() => undefined);
    throw error;
  } finally {
    await pool.client.releaseConnection(connection);
  }
}
