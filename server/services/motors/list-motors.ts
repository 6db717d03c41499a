import type { Knex } from 'knex';
import { decodeMotorCursor, encodeMotorCursor, type MotorCursor } from './motor-cursor.js';
import { resolveFilterCodes } from './motor-filter-ids.js';
import { impliedSortBounds } from './motor-list-bounds.js';
import { motorPageQuery, type MotorRow } from './motor-list-query.js';

export type MotorStatus = 'passed' | 'failed' | 'on hold' | 'not tested';
export type MotorListFilter = {
  product?: string; lot?: string; status?: MotorStatus; station?: string;
  from?: Date; to?: Date; serialPrefix?: string;
  limit: number; cursor?: string; sort: 'serial' | 'lastTestedAt'; order: 'asc' | 'desc';
};
export type MotorListItem = { serial: string; product: string; lot: string; status: MotorStatus; lastTestedAt: string | null };

const empty = { items: [], nextCursor: null };

/**
 * One page of motors, keyset-paged (never OFFSET, so page 5,000 costs what page 1 does). Codes
 * are resolved to ids first; the page is read through one index in the sort's order, led by the
 * narrowest equality filter given (motor-list-query.ts), so no filter mix sorts rows in memory;
 * a filter on the other column first narrows that read to the matches' span (motor-list-bounds.ts).
 */
export async function listMotors(db: Knex, filter: MotorListFilter): Promise<{ items: MotorListItem[]; nextCursor: string | null }> {
  const cursor = filter.cursor ? decodeMotorCursor(filter.cursor, filter.sort) : null;
  const ids = await resolveFilterCodes(db, filter);
  if (!ids) return empty;
  const bounds = await impliedSortBounds(db, filter, ids);
  if (!bounds) return empty;
  const rows: MotorRow[] = await motorPageQuery(db, filter, ids, cursor, bounds);
  const page = rows.slice(0, filter.limit);
  const last = page.at(-1);
  const nextCursor = rows.length > filter.limit && last ? encodeMotorCursor(cursorOf(last, filter.sort)) : null;
  return {
    items: page.map((r) => ({ serial: r.serial, product: r.product, lot: r.lot, status: r.status, lastTestedAt: r.last_tested_at?.toISOString() ?? null })),
    nextCursor,
  };
}

function cursorOf(row: MotorRow, sort: MotorListFilter['sort']): MotorCursor {
  return sort === 'serial' ? { sort, serial: row.serial } : { sort, testedAt: row.last_tested_at?.toISOString() ?? null, id: row.id };
}
