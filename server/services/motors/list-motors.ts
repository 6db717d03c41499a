import type { Knex } from 'knex';
import { decodeMotorCursor, encodeMotorCursor, type MotorCursor } from './motor-cursor.js';

export type MotorStatus = 'passed' | 'failed' | 'on hold' | 'not tested';
export type MotorListFilter = {
  product?: string; lot?: string; status?: MotorStatus; station?: string;
  from?: Date; to?: Date; serialPrefix?: string;
  limit: number; cursor?: string; sort: 'serial' | 'lastTestedAt'; order: 'asc' | 'desc';
};
export type MotorListItem = { serial: string; product: string; lot: string; status: MotorStatus; lastTestedAt: string | null };

/**
 * One page of motors, keyset-paged (never OFFSET, so page 5,000 costs what page 1 does). Codes
 * are resolved by subqueries MariaDB evaluates once, so each filter can use its (…, serial) index.
 */
export async function listMotors(db: Knex, filter: MotorListFilter): Promise<{ items: MotorListItem[]; nextCursor: string | null }> {
  const query = db('motors')
    .join('products', 'products.id', 'motors.product_id')
    .join('lots', 'lots.id', 'motors.lot_id')
    .select('motors.id', 'motors.serial', 'products.code as product', 'lots.code as lot', 'motors.status', 'motors.last_tested_at')
    .limit(filter.limit + 1);
  if (filter.product) query.where('motors.product_id', db('products').select('id').where({ code: filter.product }));
  if (filter.lot) query.where('motors.lot_id', db('lots').select('id').where({ code: filter.lot }));
  if (filter.station) query.where('motors.last_station_id', db('stations').select('id').where({ code: filter.station }));
  if (filter.status) query.where('motors.status', filter.status);
  if (filter.from) query.where('motors.last_tested_at', '>=', filter.from);
  if (filter.to) query.where('motors.last_tested_at', '<', filter.to);
  if (filter.serialPrefix) query.where('motors.serial', 'like', `${filter.serialPrefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  const cursor = filter.cursor ? decodeMotorCursor(filter.cursor, filter.sort) : null;
  if (filter.sort === 'serial') {
    if (cursor?.sort === 'serial') query.where('motors.serial', filter.order === 'asc' ? '>' : '<', cursor.serial);
    query.orderBy('motors.serial', filter.order);
  } else {
    if (cursor?.sort === 'lastTestedAt') afterTimeCursor(query, cursor, filter.order);
    query.orderBy([{ column: 'motors.last_tested_at', order: filter.order }, { column: 'motors.id', order: filter.order }]);
  }
  const rows = await query;
  const page = rows.slice(0, filter.limit);
  const last = page.at(-1);
  const nextCursor = rows.length > filter.limit && last ? encodeMotorCursor(cursorOf(last, filter.sort)) : null;
  return {
    items: page.map((r) => ({ serial: r.serial, product: r.product, lot: r.lot, status: r.status, lastTestedAt: r.last_tested_at?.toISOString() ?? null })),
    nextCursor,
  };
}

function cursorOf(row: { id: number; serial: string; last_tested_at: Date | null }, sort: MotorListFilter['sort']): MotorCursor {
  return sort === 'serial' ? { sort, serial: row.serial } : { sort, testedAt: row.last_tested_at?.toISOString() ?? null, id: row.id };
}

/** MariaDB sorts NULL first ascending and last descending; the cursor condition follows that. */
function afterTimeCursor(query: Knex.QueryBuilder, cursor: Extract<MotorCursor, { sort: 'lastTestedAt' }>, order: 'asc' | 'desc') {
  const beyond = order === 'asc' ? '>' : '<';
  if (cursor.testedAt === null) {
    query.where((q) => {
      q.where((n) => n.whereNull('motors.last_tested_at').andWhere('motors.id', beyond, cursor.id));
      if (order === 'asc') q.orWhereNotNull('motors.last_tested_at');
    });
    return;
  }
  const testedAt = new Date(cursor.testedAt);
  query.where((q) => {
    q.where('motors.last_tested_at', beyond, testedAt)
      .orWhere((same) => same.where('motors.last_tested_at', testedAt).andWhere('motors.id', beyond, cursor.id));
    if (order === 'desc') q.orWhereNull('motors.last_tested_at');
  });
}
