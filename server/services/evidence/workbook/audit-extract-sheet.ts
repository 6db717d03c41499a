import type { Knex } from 'knex';
import { packMotors, packRuns, packSerials } from '../pack-scope.js';
import { RollingSheet, formats } from './rolling-sheet.js';
import { fitCell, type SheetContext } from './pack-context.js';
import { canonicalJson } from '../../audit/hash.js';

type EventRow = {
  id: number; occurred_at: Date; actor: string; actor_role: string | null; action: string; entity_type: string;
  entity_id: string; reason: string | null; before_json: unknown; after_json: unknown; hash: string;
};

const serialPage = 1000;

/** Canonical JSON text whether mysql2 returned the column parsed or as text. */
function jsonText(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  return fitCell(typeof value === 'string' ? value : canonicalJson(value));
}

/** The records the pack rests on, named the way the audit trail names them (codes, not row ids). */
async function referenceEntities(ctx: SheetContext): Promise<Array<[string, string[]]>> {
  const { db, filter } = ctx;
  const pluck = async (q: Knex.QueryBuilder, column: string) => ((await q) as Array<Record<string, unknown>>).map((r) => String(r[column]));
  const lots = await pluck(packMotors(db, filter).distinct('l.code'), 'code');
  const products = ctx.totals.products.map((p) => p.code);
  const stations = await pluck(db('stations').whereIn('id', packRuns(db, filter).distinct('r.station_id')).select('code'), 'code');
  const limitSets = await pluck(packRuns(db, filter).whereNotNull('r.limit_set_id').distinct('r.limit_set_id'), 'limit_set_id');
  const characteristics = await pluck(db({ c: 'characteristics' }).join({ p: 'products' }, 'p.id', 'c.product_id')
    .whereIn('p.code', products).select(db.raw("CONCAT(p.code, '/', c.code) AS name")), 'name');
  return [['lot', lots], ['product', products], ['station', stations], ['limit_set', limitSets], ['characteristic', characteristics]];
}

function eventsFor(db: Knex, groups: Array<[string, string[]]>): Knex.QueryBuilder {
  return db('audit_events').where((q) => {
    for (const [type, ids] of groups) if (ids.length > 0) q.orWhere((g) => g.where('entity_type', type).whereIn('entity_id', ids));
  }).orderBy('id');
}

/** Audit events for the pack's motors, lots, products, stations, limit revisions and characteristics. */
export async function writeAuditExtractSheet(ctx: SheetContext): Promise<void> {
  const sheet = new RollingSheet(ctx.workbook, 'Audit extract', [
    { header: 'Event', numFmt: formats.integer }, { header: 'Time (UTC)', width: 20, numFmt: formats.dateTime },
    { header: 'Actor', width: 20 }, { header: 'Role' }, { header: 'Action', width: 26 }, { header: 'Entity type', width: 14 },
    { header: 'Entity', width: 20 }, { header: 'Reason', width: 30 }, { header: 'Before', width: 40 }, { header: 'After', width: 40 },
    { header: 'Hash', width: 66 },
  ], ctx.rowCap);
  const write = (rows: EventRow[]) => {
    for (const r of rows) {
      sheet.addRow([Number(r.id), new Date(r.occurred_at), r.actor, r.actor_role, r.action, r.entity_type, r.entity_id,
        r.reason, jsonText(r.before_json), jsonText(r.after_json), r.hash]);
    }
  };
  const groups = await referenceEntities(ctx);
  if (groups.some(([, ids]) => ids.length > 0)) write((await eventsFor(ctx.db, groups)) as EventRow[]);
  const allSerials = await packSerials(ctx.db, ctx.filter);
  for (let start = 0; start < allSerials.length; start += serialPage) {
    write((await eventsFor(ctx.db, [['motor', allSerials.slice(start, start + serialPage)]])) as EventRow[]);
    await ctx.advance(0);
  }
  sheet.commit();
}
