import type { Knex } from 'knex';

/** One SQL statement with its bindings, to be sent alone or with others in one round trip. */
export type Statement = { sql: string; bindings: readonly unknown[] };

/** Whether the pool's connections take several statements per query (statementPool). */
export function acceptsSeveralStatements(db: Knex): boolean {
  const connection = db.client.config.connection as { multipleStatements?: boolean } | undefined;
  return connection?.multipleStatements === true;
}

/**
 * Runs statements in order and returns each one's rows (or result header). On a connection that
 * accepts several statements per query (statementPool) they travel in one round trip, which on a
 * busy server is most of a statement's cost; elsewhere they are sent one after another.
 */
export async function runStatements(db: Knex, statements: readonly Statement[]): Promise<unknown[]> {
  if (statements.length === 0) return [];
  if (statements.length === 1 || !acceptsSeveralStatements(db)) {
    const results: unknown[] = [];
    for (const statement of statements) results.push((await db.raw(statement.sql, statement.bindings as Knex.RawBinding[]))[0]);
    return results;
  }
  const [results] = await db.raw(statements.map((s) => s.sql).join(';\n'), statements.flatMap((s) => s.bindings) as Knex.RawBinding[]);
  return results as unknown[];
}

/**
 * Thrown by work given only a way to send statements (directTransaction) when it meets something
 * that needs a knex transaction after all (a write that reads as it goes, such as the audit chain);
 * the caller rolls back and does the work again in a knex transaction.
 */
export class TransactionNeeded extends Error {}
