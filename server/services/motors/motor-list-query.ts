import type { Knex } from 'knex';
import type { MotorCursor } from './motor-cursor.js';
import type { FilterIds } from './motor-filter-ids.js';
import type { MotorListFilter, MotorStatus } from './list-motors.js';
import type { SortBounds } from './motor-list-bounds.js';

export type Lead = 'none' | 'lot' | 'station' | 'status' | 'product';

/** The list's indexes (migrations/20261202000200_motors_list_indexes.ts) by sort and leading filter. */
export const listIndexes: Record<MotorListFilter['sort'], Record<Lead, string>> = {
  serial: {
    none: 'motors_list_serial', lot: 'motors_lot_id_serial_index', station: 'motors_list_station_serial',
    status: 'motors_list_status_serial', product: 'motors_list_product_serial',
  },
  lastTestedAt: {
    none: 'motors_list_time', lot: 'motors_list_lot_time', station: 'motors_list_station_time',
    status: 'motors_list_status_time', product: 'motors_list_product_time',
  },
};

/**
 * The equality filter that narrows most, to lead the index: a lot (hundreds of motors), a station
 * (one stand's share), a status other than passed (the exceptions), the product; a status of
 * passed, which most motors have, only when nothing else is given.
 */
export function leadingFilter(filter: Pick<MotorListFilter, 'status'>, ids: FilterIds): Lead {
  if (ids.lotId !== undefined) return 'lot';
  if (ids.stationId !== undefined) return 'station';
  if (filter.status && filter.status !== 'passed') return 'status';
  if (ids.productId !== undefined) return 'product';
  return filter.status ? 'status' : 'none';
}

/**
 * Motors read through one named list index. Named because, left to choose among them, MariaDB took
 * the product's index for a product and a date range and read 120k rows to fill a page; each list
 * index reads in its sort's order, so no filter mix ends in a sort of the matching motors.
 */
export function motorsThrough(db: Knex, sort: MotorListFilter['sort'], filter: MotorListFilter, ids: FilterIds): Knex.QueryBuilder {
  const query = db.from(db.raw('?? FORCE INDEX (??)', ['motors', listIndexes[sort][leadingFilter(filter, ids)]]));
  if (ids.lotId !== undefined) query.where('motors.lot_id', ids.lotId);
  else if (ids.productId !== undefined) query.where('motors.product_id', ids.productId);
  if (ids.stationId !== undefined) query.where('motors.last_station_id', ids.stationId);
  if (filter.status) query.where('motors.status', filter.status);
  if (filter.from) query.where('motors.last_tested_at', '>=', filter.from);
  if (filter.to) query.where('motors.last_tested_at', '<', filter.to);
  if (filter.serialPrefix) query.where('motors.serial', 'like', `${filter.serialPrefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  return query;
}

export type MotorRow = { id: number; serial: string; product: string; lot: string; status: MotorStatus; last_tested_at: Date | null };

/** The page's query (one row more than the page, to know whether another follows); exported for the benchmark's EXPLAIN. */
export function motorPageQuery(db: Knex, filter: MotorListFilter, ids: FilterIds, cursor: MotorCursor | null, bounds: SortBounds = {}): Knex.QueryBuilder {
  // Codes by subqueries in the select list rather than joins: with motors the only table in FROM,
  // MariaDB cannot start from lots or products and sort every motor it reaches; the subqueries
  // run for the rows of the page only.
  const query = motorsThrough(db, filter.sort, filter, ids)
    .select('motors.id', 'motors.serial', 'motors.status', 'motors.last_tested_at', {
      product: db('products').select('code').where('products.id', db.ref('motors.product_id')),
      lot: db('lots').select('code').where('lots.id', db.ref('motors.lot_id')),
    })
    .limit(filter.limit + 1);
  if (bounds.serial) within(query, 'motors.serial', bounds.serial.first, bounds.serial.last);
  if (bounds.testedAt) withinTested(query, bounds.testedAt);
  if (filter.sort === 'serial') {
    if (cursor?.sort === 'serial') query.where('motors.serial', filter.order === 'asc' ? '>' : '<', cursor.serial);
    query.orderBy('motors.serial', filter.order);
  } else {
    if (cursor?.sort === 'lastTestedAt') afterTimeCursor(query, cursor, filter.order);
    query.orderBy([{ column: 'motors.last_tested_at', order: filter.order }, { column: 'motors.id', order: filter.order }]);
  }
  return query;
}

/** An equality when the span is one value: MariaDB sorted the rows of `BETWEEN x AND x`. */
function within(query: Knex.QueryBuilder, column: string, first: string | Date, last: string | Date) {
  const same = first instanceof Date && last instanceof Date ? first.getTime() === last.getTime() : first === last;
  if (same) query.where(column, first);
  else query.whereBetween(column, [first, last]);
}

function withinTested(query: Knex.QueryBuilder, span: NonNullable<SortBounds['testedAt']>) {
  const { first, last, untested } = span;
  query.where((q) => {
    if (first && last) within(q, 'motors.last_tested_at', first, last);
    if (untested) q.orWhereRaw('?? <=> NULL', ['motors.last_tested_at']);
  });
}

/** MariaDB sorts NULL first ascending and last descending; the cursor condition follows that. */
function afterTimeCursor(query: Knex.QueryBuilder, cursor: Extract<MotorCursor, { sort: 'lastTestedAt' }>, order: 'asc' | 'desc') {
  const beyond = order === 'asc' ? '>' : '<';
  if (cursor.testedAt === null) {
    query.where((q) => {
      // `<=> NULL` rather than IS NULL: MariaDB reads a null-safe equality as a constant key part
      // and keeps the index order; with IS NULL it sorted the untested block.
      q.where((n) => n.whereRaw('?? <=> NULL', ['motors.last_tested_at']).andWhere('motors.id', beyond, cursor.id));
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
