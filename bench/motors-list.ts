import type { MotorListFilter } from '../server/services/motors/list-motors.js';
import { motorPageQuery } from '../server/services/motors/motor-list-query.js';
import { resolveFilterCodes } from '../server/services/motors/motor-filter-ids.js';
import { impliedSortBounds } from '../server/services/motors/motor-list-bounds.js';
import { benchProductCode, type BenchDataset } from './dataset.js';
import { clientToken, type BenchContext } from './harness.js';
import { percentile, round } from './stats.js';

const repeats = 40;
const pageLimit = 50;

/**
 * The Motors list API at plant scale (our own target: p95 ≤ 100 ms per request) for filter mixes
 * a person uses, and the worst kind the indexes allow: a filter that matches nothing, checked
 * inside the index over every motor. Beside it, EXPLAIN of every filter mix with both sorts and
 * orders, counting any that would sort rows instead of reading an index in order.
 */
export async function benchMotorsList(ctx: BenchContext, dataset: BenchDataset) {
  const token = await clientToken(ctx.idpUrl, 'demo-integration', 'demo-integration-secret', 'records:read');
  const span = await ctx.db('motors').where({ product_id: dataset.productId }).first(ctx.db.raw('MIN(last_tested_at) AS first'), ctx.db.raw('MAX(last_tested_at) AS last'));
  // Day 178 of the year: the week holds lot BL-123 and part of the BX12… batch, so every mix of the EXPLAIN matches.
  const weekFrom = new Date(span.first.getTime() + 178 * 86_400_000);
  const week = `from=${weekFrom.toISOString()}&to=${new Date(weekFrom.getTime() + 7 * 86_400_000).toISOString()}`;
  const newest = 'sort=lastTestedAt&order=desc';
  const mixes: Array<{ name: string; query: string }> = [
    { name: 'all motors, newest first (the screen default)', query: newest },
    { name: 'all motors by serial (the API default)', query: 'sort=serial&order=asc' },
    { name: 'one lot, newest first', query: `lot=BL-123&${newest}` },
    { name: 'one station in a week, newest first', query: `station=BENCH-S05&${week}&${newest}` },
    { name: 'product and failed (none are), newest first', query: `product=${benchProductCode}&status=failed&${newest}` },
    { name: 'serial prefix of a mid-year batch, newest first', query: `serialPrefix=BX12&${newest}` },
    { name: 'a week, by serial', query: `${week}&sort=serial&order=asc` },
    { name: 'serial prefix matching nothing, newest first', query: `serialPrefix=BX9&${newest}` },
    // Past 20,000 matches no span is sought: the worst case left, one ordered pass over half the index.
    { name: 'tested since mid-year (128k motors), by serial', query: `from=${weekFrom.toISOString()}&sort=serial&order=asc` },
    { name: 'page 200 of all motors, newest first', query: `${newest}&cursor=${await cursorAfter(ctx, token, newest, 199)}` },
  ];
  const combinations = [];
  for (const mix of mixes) {
    const url = `${ctx.app.url}/api/v1/motors?limit=${pageLimit}&${mix.query}`;
    const get = async () => {
      const response = await fetch(url, { headers: { authorization: `Bearer ${token}` } });
      if (response.status !== 200) throw new Error(`motors API answered ${response.status}: ${await response.text()}`);
      return (await response.json()) as { items: unknown[] };
    };
    for (let i = 0; i < 3; i++) await get(); // warm-up, not counted
    const timesMs: number[] = [];
    let rows = 0;
    for (let i = 0; i < repeats; i++) {
      const start = performance.now();
      rows = (await get()).items.length;
      timesMs.push(performance.now() - start);
    }
    combinations.push({ ...mix, rows, p50Ms: round(percentile(timesMs, 50)), p95Ms: round(percentile(timesMs, 95)) });
    ctx.log(`motors list: ${mix.name}: p50 ${round(percentile(timesMs, 50))} ms, p95 ${round(percentile(timesMs, 95))} ms`);
  }
  const motors = Number((await ctx.db('motors').count({ n: '*' }).first())?.n ?? 0);
  return { motors, pageLimit, repeats, combinations, explain: await explainEveryMix(ctx, weekFrom), target: 'p95 ≤ 100 ms per request (our own target)' };
}

/** The cursor of page `pages + 1` of a listing, found by paging through it once. */
async function cursorAfter(ctx: BenchContext, token: string, query: string, pages: number): Promise<string> {
  let cursor = '';
  for (let page = 0; page < pages; page++) {
    const response = await fetch(`${ctx.app.url}/api/v1/motors?limit=${pageLimit}&${query}${cursor ? `&cursor=${cursor}` : ''}`, { headers: { authorization: `Bearer ${token}` } });
    cursor = ((await response.json()) as { nextCursor: string }).nextCursor;
  }
  return cursor;
}

/** EXPLAIN of each of the 128 filter mixes × 2 sorts × 2 orders; counts plans that sort. */
async function explainEveryMix(ctx: BenchContext, weekFrom: Date) {
  const values: Omit<MotorListFilter, 'limit' | 'sort' | 'order' | 'cursor'> = {
    product: benchProductCode, lot: 'BL-123', status: 'passed', station: 'BENCH-S05',
    from: weekFrom, to: new Date(weekFrom.getTime() + 7 * 86_400_000), serialPrefix: 'BX12',
  };
  const keys = Object.keys(values) as Array<keyof typeof values>;
  let plans = 0;
  const sorting: string[] = [];
  for (let mask = 0; mask < 1 << keys.length; mask++) {
    const chosen = Object.fromEntries(keys.filter((_, i) => mask & (1 << i)).map((k) => [k, values[k]]));
    for (const sort of ['serial', 'lastTestedAt'] as const) {
      for (const order of ['asc', 'desc'] as const) {
        const filter: MotorListFilter = { ...chosen, limit: pageLimit, sort, order };
        const ids = await resolveFilterCodes(ctx.db, filter);
        const bounds = ids && await impliedSortBounds(ctx.db, filter, ids);
        if (!ids || !bounds) continue; // nothing can match: no page query runs
        const [plan] = await ctx.db.raw(`EXPLAIN ${motorPageQuery(ctx.db, filter, ids, null, bounds).toString()}`);
        plans++;
        if ((plan as Array<{ Extra: string | null }>).some((row) => row.Extra?.includes('filesort'))) sorting.push(`${Object.keys(chosen).join('+') || 'none'} ${sort} ${order}`);
      }
    }
  }
  return { plans, usingFilesort: sorting.length, sorting };
}
