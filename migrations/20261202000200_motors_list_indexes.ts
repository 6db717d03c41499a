import type { Knex } from 'knex';

// The Motors list (GET /api/v1/motors) pages by serial or by (last_tested_at, id) under any mix of
// the filters product, lot, status, station, tested from/to and serial prefix. For each sort there
// is one index without a leading filter and one led by each equality filter, in the sort's order,
// so the page is read in order and never sorted. Each (but the lot's) also holds every column the
// list filters on or returns: a filter that matches few motors (a rare status, a date range under
// serial order, a serial prefix under time order) is then checked inside the index, never by a row
// lookup per rejected motor. Covering matters because MariaDB 10.11 checks conditions inside the
// index (index condition pushdown) only when reading forwards, and the list is newest first by
// default. A lot's motors are few, so its indexes stay narrow. Existing indexes with the same
// leading columns are replaced by the wider ones, which serve their other uses as before.
// listMotors picks one per request (list-motors.ts).
// Outside a transaction: MariaDB commits DDL implicitly anyway.
export const config = { transaction: false };

const listColumns = ['serial', 'last_tested_at', 'status', 'last_station_id', 'product_id', 'lot_id'];
const serialKey = ['serial'];
const timeKey = ['last_tested_at', 'id'];

/** The leading filter column, the sort key, then every other list column. */
const covering = (lead: string[], sortKey: string[]) => [...lead, ...sortKey, ...listColumns.filter((c) => !lead.includes(c) && !sortKey.includes(c))];

const added: Array<[string, string[]]> = [
  ['motors_list_serial', covering([], serialKey)],
  ['motors_list_product_serial', covering(['product_id'], serialKey)],
  ['motors_list_status_serial', covering(['status'], serialKey)],
  ['motors_list_station_serial', covering(['last_station_id'], serialKey)],
  ['motors_list_time', covering([], timeKey)],
  ['motors_list_product_time', covering(['product_id'], timeKey)],
  ['motors_list_status_time', covering(['status'], timeKey)],
  ['motors_list_station_time', covering(['last_station_id'], timeKey)],
  ['motors_list_lot_time', ['lot_id', ...timeKey]], // (lot_id, serial) exists already
];

/** Superseded by a wider index with the same leading columns. */
const replaced: Array<[string, string[]]> = [
  ['motors_product_id_serial_index', ['product_id', 'serial']],
  ['motors_status_serial_index', ['status', 'serial']],
  ['motors_last_station_id_serial_index', ['last_station_id', 'serial']],
  ['motors_last_tested_at_id_index', ['last_tested_at', 'id']],
];

export async function up(knex: Knex): Promise<void> {
  // Wider indexes first: the product_id foreign key must never be left without an index.
  await knex.schema.alterTable('motors', (t) => {
    for (const [name, columns] of added) t.index(columns, name);
  });
  await knex.schema.alterTable('motors', (t) => {
    for (const [name] of replaced) t.dropIndex([], name);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('motors', (t) => {
    for (const [name, columns] of replaced) t.index(columns, name);
  });
  await knex.schema.alterTable('motors', (t) => {
    for (const [name] of added) t.dropIndex([], name);
  });
}
