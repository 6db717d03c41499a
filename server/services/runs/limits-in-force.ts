import type { Knex } from 'knex';
import { runStatements, type Statement } from '../../db/statements.js';
import { StatementTemplates, valueList } from '../../db/statement-templates.js';
import { knownApprovedRevisions, loadApprovedLimits, rememberApprovedRevisions, type ApprovedRevision, type LimitRow } from './reference-data.js';

export type LimitSetInForce = { id: number; revision: number; effectiveFrom: Date; limits: Map<number, LimitRow> };

// Each product's approved revisions, newest first, are kept per process (reference-data.ts).
// Ingest judges with that list before its transaction and every ingest batch reads the list again
// inside its transaction (confirm-limits.ts), re-judging a run whose revision changed meanwhile;
// so an approval takes effect at once without a query per run.

type RevisionRow = { id: number; product_id: number; revision: number; effective_from: Date };

/** The query for the approved revisions of these products, newest first. */
export function approvedRevisionsStatement(db: Knex, productIds: readonly number[]): Statement {
  return approvedRevisionsTemplates.statements(db, productIds.length, productIds)[0];
}

// Built once per number of products (every ingest batch reads them).
const approvedRevisionsTemplates = new StatementTemplates<number>((db, count, value) => [db('limit_sets')
  .whereIn('product_id', valueList(count, value)).andWhere({ status: 'approved' })
  .orderBy([{ column: 'effective_from', order: 'desc' }, { column: 'revision', order: 'desc' }])
  .select('id', 'product_id', 'revision', 'effective_from')
  .toSQL()]);

/** Each product's approved revisions from that query's rows, kept for the next runs of this process. */
export function rememberRevisionRows(productIds: readonly number[], rows: readonly RevisionRow[]): Map<number, ApprovedRevision[]> {
  const read = new Map<number, ApprovedRevision[]>(productIds.map((id) => [id, []]));
  for (const row of rows) read.get(row.product_id)?.push({ id: row.id, revision: row.revision, effectiveFrom: row.effective_from });
  for (const [productId, revisions] of read) rememberApprovedRevisions(productId, revisions);
  return read;
}

/** Reads the approved revisions of these products (one query) and keeps them for the next runs. */
export async function readApprovedRevisions(db: Knex, productIds: readonly number[]): Promise<Map<number, ApprovedRevision[]>> {
  const [rows] = await runStatements(db, [approvedRevisionsStatement(db, productIds)]);
  return rememberRevisionRows(productIds, rows as RevisionRow[]);
}

/** The revision in force at a moment: the latest effectiveFrom not after it (then the higher revision). */
export function revisionInForce(newestFirst: readonly ApprovedRevision[], at: Date): ApprovedRevision | null {
  return newestFirst.find((r) => r.effectiveFrom.getTime() <= at.getTime()) ?? null;
}

/** A revision with its limits (immutable once approved, so cached by id). */
export async function withLimits(db: Knex, revision: ApprovedRevision): Promise<LimitSetInForce> {
  return { ...revision, limits: await loadApprovedLimits(db, revision.id) };
}

/**
 * The approved limit revision in force at a moment. `fresh` reads the revisions now (a stand
 * loading its test plan); otherwise this process's list is used, read on first need and kept
 * current by every ingest batch. "None in force" is always read fresh before it is believed.
 */
export async function limitsInForce(db: Knex, productId: number, at: Date, options: { fresh?: boolean } = {}): Promise<LimitSetInForce | null> {
  const known = options.fresh ? undefined : knownApprovedRevisions(productId);
  const revision = (known && revisionInForce(known, at)) ?? revisionInForce((await readApprovedRevisions(db, [productId])).get(productId) ?? [], at);
  return revision ? withLimits(db, revision) : null;
}
