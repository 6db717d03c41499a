import type { Knex } from 'knex';
import { packMotors, type PackTotals } from '../pack-scope.js';
import { eachPageReadAhead } from '../read-ahead.js';
import { RollingSheet, formats } from './rolling-sheet.js';
import { fitCell, type PassContext, type SheetContext } from './pack-context.js';

type EventRow = {
  id: number; occurred_at: Date; actor: string; actor_role: string | null; action: string; entity_type: string;
  entity_id: string; reason: string | null; before_json: string | null; after_json: string | null; hash: string;
};

// Short IN lists keep MariaDB on the (entity_type, entity_id) index: at 1000 values the list
// becomes a derived table, and past eq_range_index_dive_limit (200) the plan is guessed from
// statistics and may walk every motor event.
const serialPage = 200;
const eventPage = 500;

/** The records the pack rests on, named the way the audit trail names them (codes, not row ids). */
async function referenceEntities(ctx: PassContext, totals: PackTotals): Promise<Array<[string, string[]]>> {
  const { db, filter } = ctx;
  const pluck = async (q: Knex.QueryBuilder, column: string) => ((await q) as Array<Record<string, unknown>>).map((r) => String(r[column]));
  const lots = await pluck(packMotors(db, filter).distinct('l.code'), 'code');
  const products = totals.products.map((p) => p.code);
  const stations = await pluck(db('stations').whereIn('id', totals.stationIds).select('code'), 'code');
  const limitSets = totals.limitSetIds.map(String);
  const characteristics = await pluck(db({ c: 'characteristics' }).join({ p: 'products' }, 'p.id', 'c.product_id')
    .whereIn('p.code', products).select(db.raw("CONCAT(p.code, '/', c.code) AS name")), 'name');
  return [['lot', lots], ['product', products], ['station', stations], ['limit_set', limitSets], ['characteristic', characteristics]];
}

/** Ids of the events about the given entities, from the (entity_type, entity_id, id) index alone. */
async function eventIds(db: Knex, groups: Array<[string, string[]]>): Promise<number[]> {
  if (!groups.some(([, ids]) => ids.length > 0)) return [];
  const rows = (await db('audit_events').where((q) => {
    for (const [type, ids] of groups) if (ids.length > 0) q.orWhere((g) => g.where('entity_type', type).whereIn('entity_id', ids));
  }).select('id').options({ rowsAsArray: true })) as Array<[number | string]>;
  return rows.map((row) => Number(row[0]));
}

function eventsById(db: Knex, ids: number[]): Promise<EventRow[]> {
  // The JSON columns as their stored text: the canonical JSON that was hashed, not a re-spelling.
  return db('audit_events').whereIn('id', ids).orderBy('id')
    .select('id', 'occurred_at', 'actor', 'actor_role', 'action', 'entity_type', 'entity_id', 'reason', 'hash',
      db.raw('CAST(before_json AS CHAR) AS before_json'), db.raw('CAST(after_json AS CHAR) AS after_json'))
    .then((rows: EventRow[]) => rows);
}

/**
 * The ids of every audit event about the pack's motors, lots, products, stations, limit revisions
 * and characteristics, oldest first, from the entity index alone. Index-only work for MariaDB, so
 * it can run beside the writing of other sheets; the motors' events are looked up first, as the
 * other records are known only once the pack is counted.
 */
export async function auditEventIds(ctx: PassContext, totals: Promise<PackTotals>): Promise<number[]> {
  const ids: number[] = [];
  const serials = await ctx.serials();
  await eachPageReadAhead(Math.ceil(serials.length / serialPage),
    (page) => eventIds(ctx.db, [['motor', serials.slice(page * serialPage, (page + 1) * serialPage)]]),
    async (found) => { for (const id of found) ids.push(id); });
  for (const id of await eventIds(ctx.db, await referenceEntities(ctx, await totals))) ids.push(id);
  return ids.sort((a, b) => a - b);
}

/**
 * The events found by auditEventIds, read by primary key in id order, which keeps MariaDB's page
 * reads close together however scattered a motor's events are.
 */
export async function writeAuditExtractSheet(ctx: SheetContext, ids: number[]): Promise<void> {
  const sheet = new RollingSheet(ctx.workbook, 'Audit extract', [
    { header: 'Event', numFmt: formats.integer }, { header: 'Time (UTC)', width: 20, numFmt: formats.dateTime },
    { header: 'Actor', width: 20 }, { header: 'Role' }, { header: 'Action', width: 26 }, { header: 'Entity type', width: 14 },
    { header: 'Entity', width: 20 }, { header: 'Reason', width: 30 }, { header: 'Before', width: 40 }, { header: 'After', width: 40 },
    { header: 'Hash', width: 66 },
  ], ctx.rowCap);
  await eachPageReadAhead(Math.ceil(ids.length / eventPage), (page) => eventsById(ctx.db, ids.slice(page * eventPage, (page + 1) * eventPage)), async (rows) => {
    for (const r of rows) {
      sheet.addRow([Number(r.id), new Date(r.occurred_at), r.actor, r.actor_role, r.action, r.entity_type, r.entity_id,
        r.reason, fitCell(r.before_json), fitCell(r.after_json), r.hash]);
    }
    await sheet.settle();
    await ctx.advance(0);
  });
  sheet.commit();
}
