import { rebuildYieldRollups } from '../server/services/yield/update-yield-rollups.js';
import type { BenchDataset } from './dataset.js';
import { clientToken, type BenchContext } from './harness.js';
import { medianMs } from './stats.js';

const groupings = ['day', 'week', 'shift', 'line', 'station', 'product', 'lot'] as const;

function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/**
 * The yield API over a year of the plant-scale set (target ≤ 200 ms per grouping) beside the bare
 * GROUP BY over the raw runs that the API would need without its rollups (the ceiling of a
 * rollup-free design) — both on the same data in the same run.
 */
export async function benchYield(ctx: BenchContext, dataset: BenchDataset) {
  const marker = await ctx.db('app_meta').where({ meta_key: 'bench_yield_rollups' }).first();
  if (!marker) {
    ctx.log('yield: building the rollups once for the bulk-loaded set…');
    await rebuildYieldRollups(ctx.db);
    await ctx.db('app_meta').insert({ meta_key: 'bench_yield_rollups', meta_value: 'v1', updated_at: new Date() });
  }
  const token = await clientToken(ctx.idpUrl, 'demo-integration', 'demo-integration-secret', 'records:read');
  const to = new Date();
  const from = new Date(to.getTime() - 364 * 86_400_000);
  const apiMedianMs: Record<string, number> = {};
  for (const groupBy of groupings) {
    const url = `${ctx.app.url}/api/v1/yield?from=${isoDay(from)}&to=${isoDay(to)}&groupBy=${groupBy}`;
    apiMedianMs[groupBy] = await medianMs(async () => {
      const response = await fetch(url, { headers: { authorization: `Bearer ${token}` } });
      if (response.status !== 200) throw new Error(`yield API answered ${response.status}: ${await response.text()}`);
      await response.json();
    }, 9);
  }
  ctx.log('yield: the bare GROUP BY over the raw runs…');
  const bareGroupByDayMs = await medianMs(() => ctx.db.raw(`
    SELECT DATE(first.started_at) AS day, COUNT(*) AS tested,
           SUM(first.verdict = 'pass') AS passed_first, SUM(latest.verdict = 'pass') AS passed_final
    FROM motors m
    JOIN test_runs first ON first.motor_id = m.id AND first.attempt = 1
    JOIN test_runs latest ON latest.id = m.latest_run_id
    WHERE m.product_id = ? AND first.started_at >= ? AND first.started_at < ?
    GROUP BY DATE(first.started_at)`, [dataset.productId, from, to]), 5);
  return { motors: dataset.motors, apiMedianMs, bareGroupByDayMs, target: '≤ 200 ms per grouping' };
}
