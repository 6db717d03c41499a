import type { Knex } from 'knex';
import { invalid } from '../../errors.js';

export type LotCounts = { motors: number; passed: number; failed: number; onHold: number; notTested: number };
export type LotListItem = { code: string; product: string; createdAt: string; activeHolds: number; counts: LotCounts };
export type LotListFilter = { product?: string; limit: number; cursor?: string };

const emptyCounts = (): LotCounts => ({ motors: 0, passed: 0, failed: 0, onHold: 0, notTested: 0 });
const countKey = { passed: 'passed', failed: 'failed', 'on hold': 'onHold', 'not tested': 'notTested' } as const;

/** Lots newest first, keyset-paged on id, each with its motors counted by status and its active holds. */
export async function listLots(db: Knex, filter: LotListFilter): Promise<{ items: LotListItem[]; nextCursor: string | null }> {
  const query = db('lots').join('products', 'products.id', 'lots.product_id')
    .select('lots.id', 'lots.code', 'products.code as product', 'lots.created_at')
    .orderBy('lots.id', 'desc').limit(filter.limit + 1);
  if (filter.product) query.where('products.code', filter.product);
  if (filter.cursor) query.where('lots.id', '<', decodeLotCursor(filter.cursor));
  const rows = await query;
  const page = rows.slice(0, filter.limit);
  const ids = page.map((r) => r.id);
  const counts = await countsByLot(db, ids);
  const holds = ids.length === 0 ? [] : await db('holds').whereIn('lot_id', ids).whereNull('released_at').groupBy('lot_id')
    .select<Array<{ lot_id: number; n: number }>>('lot_id', db.raw('COUNT(*) AS n'));
  const holdCount = new Map(holds.map((h) => [h.lot_id, Number(h.n)]));
  const last = page.at(-1);
  return {
    items: page.map((r) => ({
      code: r.code, product: r.product, createdAt: r.created_at.toISOString(),
      activeHolds: holdCount.get(r.id) ?? 0, counts: counts.get(r.id) ?? emptyCounts(),
    })),
    nextCursor: rows.length > filter.limit && last ? Buffer.from(String(last.id)).toString('base64url') : null,
  };
}

/** Motors per status for each lot (the (lot_id, serial) index narrows the scan to these lots). */
export async function countsByLot(db: Knex, lotIds: readonly number[]): Promise<Map<number, LotCounts>> {
  const result = new Map<number, LotCounts>();
  if (lotIds.length === 0) return result;
  const rows = await db('motors').whereIn('lot_id', lotIds).groupBy('lot_id', 'status')
    .select<Array<{ lot_id: number; status: keyof typeof countKey; n: number }>>('lot_id', 'status', db.raw('COUNT(*) AS n'));
  for (const row of rows) {
    const counts = result.get(row.lot_id) ?? emptyCounts();
    const n = Number(row.n);
    counts[countKey[row.status]] += n;
    counts.motors += n;
    result.set(row.lot_id, counts);
  }
  return result;
}

function decodeLotCursor(cursor: string): number {
  const id = Number(Buffer.from(cursor, 'base64url').toString('utf8'));
  if (!Number.isInteger(id) || id < 1) throw invalid([{ field: 'cursor', message: 'is not a cursor of this list; pass back nextCursor unchanged' }]);
  return id;
}
