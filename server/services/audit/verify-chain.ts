import type { Knex } from 'knex';
import { auditHash, chainHash, genesisHash, storedContentJson, type StoredAuditContent } from './hash.js';

export type ChainVerdict = { ok: boolean; checked: number; firstBrokenId?: number; problem?: string };

// One row as an array (rowsAsArray), the time as its DATETIME text and the JSON columns as their
// stored text: no Date objects, no JSON parsing, and the stored text is what was hashed.
type StoredRow = [
  id: number | string, occurredAt: string, actor: string, actorRole: string | null, action: string,
  entityType: string, entityId: string, beforeJson: string | null, afterJson: string | null,
  reason: string | null, prevHash: string, hash: string,
];

const columns = `id, occurred_at, actor, actor_role, action, entity_type, entity_id,
  CAST(before_json AS CHAR) AS before_json, CAST(after_json AS CHAR) AS after_json, reason, prev_hash, hash`;

const sqlDateTime3 = /^\d{4}-\d\d-\d\d \d\d:\d\d:\d\d\.\d{3}$/;

/** 'YYYY-MM-DD hh:mm:ss.sss' (UTC, as the session reads it) as toISOString() writes the same instant. */
function isoFromSqlDateTime(text: string): string {
  return sqlDateTime3.test(text) ? `${text.slice(0, 10)}T${text.slice(11)}Z` : new Date(`${text}Z`).toISOString();
}

function storedContent(row: StoredRow): StoredAuditContent {
  return {
    occurredAt: isoFromSqlDateTime(row[1]), actor: row[2], actorRole: row[3], action: row[4],
    entityType: row[5], entityId: row[6], beforeJson: row[7], afterJson: row[8], reason: row[9],
  };
}

/**
 * Whether the row's hash covers its content. The fast way hashes the stored JSON text as it is;
 * only when that differs is the text parsed and re-written canonically, as it was when recorded,
 * so a row whose JSON was stored in another spelling is still judged exactly.
 */
function contentMatches(prevHash: string, row: StoredRow): boolean {
  const content = storedContent(row);
  if (chainHash(prevHash, storedContentJson(content)) === row[11]) return true;
  const { beforeJson, afterJson, ...rest } = content;
  const parse = (text: string | null): unknown => (text === null ? null : JSON.parse(text));
  return auditHash(prevHash, { ...rest, before: parse(beforeJson), after: parse(afterJson) }) === row[11];
}

/** Pages of the chain read ahead while one is hashed, each on its own connection (two helped most
 * when MariaDB had to fetch the pages from disk after a restart). */
const readAhead = 2;

/**
 * Walks the whole chain in id order in pages (memory stays flat) and recomputes every hash.
 * An edited row fails its own hash; a deleted row breaks the next row's link; a deleted tail
 * no longer matches the chain head.
 */
export async function verifyAuditChain(
  db: Knex,
  onProgress?: (checked: number, total: number) => void,
  pageSize = 2500,
): Promise<ChainVerdict> {
  // Head and newest id in one statement, so they are one snapshot: events appended while the
  // chain is walked lie beyond maxId and are left for the next check.
  const [start] = (await db.raw(`SELECT h.last_id, h.last_hash, (SELECT COALESCE(MAX(id), 0) FROM audit_events) AS max_id
    FROM audit_chain_head h WHERE h.id = 1`))[0] as Array<{ last_id: number | string; last_hash: string; max_id: number | string }>;
  const maxId = Number(start?.max_id ?? 0);
  const counted = db('audit_events').where('id', '<=', maxId).count({ n: '*' }).first().then((row) => Number(row?.n ?? 0));
  // Pages are id ranges, not "the next n rows", so several can be asked for before the first
  // arrives; a gap in the ids (a deleted row) just makes a page shorter.
  const page = (afterId: number): Promise<StoredRow[]> => db('audit_events').select(db.raw(columns))
    .where('id', '>', afterId).andWhere('id', '<=', Math.min(afterId + pageSize, maxId)).orderBy('id')
    .options({ rowsAsArray: true, dateStrings: true })
    .then((rows: StoredRow[]) => rows);
  const pending: Array<Promise<StoredRow[]>> = [];
  let nextAfterId = 0;
  const askForNext = () => {
    if (nextAfterId >= maxId) return;
    const reading = page(nextAfterId);
    reading.catch(() => undefined); // awaited in order below; this only keeps an early failure from counting as unhandled
    pending.push(reading);
    nextAfterId += pageSize;
  };
  const stop = async (verdict: ChainVerdict) => {
    await Promise.allSettled([...pending, counted]);
    return verdict;
  };
  for (let i = 0; i < readAhead; i++) askForNext();
  const total = await counted;
  let prevHash = genesisHash;
  let lastId = 0;
  let checked = 0;
  while (pending.length > 0) {
    const rows = await pending.shift()!;
    askForNext();
    for (const row of rows) {
      const id = Number(row[0]);
      if (row[10] !== prevHash) {
        return stop({ ok: false, checked, firstBrokenId: id, problem: 'link to the previous event is broken (an event before it was deleted or altered)' });
      }
      if (!contentMatches(prevHash, row)) {
        return stop({ ok: false, checked, firstBrokenId: id, problem: 'content does not match its hash (the event was altered)' });
      }
      prevHash = row[11];
      lastId = id;
      checked += 1;
    }
    onProgress?.(checked, total);
  }
  if (!start || Number(start.last_id) !== lastId || start.last_hash !== prevHash) {
    return { ok: false, checked, firstBrokenId: Number(start?.last_id ?? lastId), problem: 'the newest events were deleted (chain head does not match)' };
  }
  return { ok: true, checked };
}
