import type { Knex } from 'knex';
import { rebuildSpcDisplayBlocks } from '../server/services/spc/display-blocks.js';
import { type BenchDataset } from './dataset.js';
import { clientToken, type BenchContext } from './harness.js';
import { medianMs, round } from './stats.js';

const charted = 1_000_000;
const topUpMarker = 'bench_spc_chart_topup';
const topUpVersion = 'v2-C01-1M-hashed';

/**
 * C01 gets extra runs until it holds a million values: three copies of every bench run (new
 * uuid, attempt a million later, clear of the raw-ceiling ingest's attempts), written by SQL once
 * and remembered in app_meta. Their values follow the bench's own distribution (sum of three
 * uniforms from hashes of the run id), so limits and rules see an in-control process.
 */
async function topUpFirstCharacteristic(ctx: BenchContext, dataset: BenchDataset): Promise<void> {
  const marker = await ctx.db('app_meta').where({ meta_key: topUpMarker }).first();
  if (marker?.meta_value === topUpVersion) return;
  const c01 = dataset.characteristicIds[0];
  const copies = await ctx.db('test_runs').where({ program_version: 'bench-topup' }).count({ n: '*' }).first();
  for (let copy = 1; Number(copies?.n ?? 0) === 0 && copy <= 3; copy++) {
    ctx.log(`spc chart: topping C01 up, copy ${copy} of 3 of the bench runs…`);
    await ctx.db.raw(
      `INSERT INTO test_runs (run_uuid, motor_id, station_id, lot_id, attempt, started_at, finished_at, operator_badge, program_version,
         limit_set_id, verdict, calibration_ok, calibration_due, body_sha256, response_json, source, received_at)
       SELECT UUID(), r.motor_id, r.station_id, r.lot_id, r.attempt + ?, r.started_at + INTERVAL ? SECOND, r.finished_at + INTERVAL ? SECOND,
         r.operator_badge, 'bench-topup', r.limit_set_id, r.verdict, r.calibration_ok, r.calibration_due, r.body_sha256, '{}', r.source, r.received_at
         FROM test_runs r JOIN lots l ON l.id = r.lot_id
        WHERE l.product_id = ? AND r.program_version = 'bench-1' AND r.attempt = 1
        ORDER BY r.id`,
      [1_000_000 * copy, copy * 20, copy * 20, dataset.productId],
    );
  }
  // An earlier version of the top-up wrote other values; the copies' C01 values are written afresh.
  await ctx.db.raw(`DELETE m FROM measurements m JOIN test_runs r ON r.id = m.run_id WHERE r.program_version = 'bench-topup' AND m.characteristic_id = ?`, [c01]);
  const n = await countOf(ctx.db, c01);
  ctx.log(`spc chart: ${n} C01 values before the top-up; adding values for the new runs…`);
  const uniform = (salt: string) => `CONV(SUBSTRING(MD5(CONCAT(r.id, '${salt}')), 1, 8), 16, 10) / 4294967296`;
  await ctx.db.raw(
    `INSERT INTO measurements (run_id, characteristic_id, value, lsl, usl, verdict)
     SELECT r.id, ?, ROUND(100 + (${uniform('a')} + ${uniform('b')} + ${uniform('c')} - 1.5) * 4, 3), 90, 110, 'pass'
       FROM test_runs r WHERE r.program_version = 'bench-topup'
      ORDER BY r.id LIMIT ?`,
    [c01, Math.max(0, charted - n)],
  );
  await ctx.db('app_meta').insert({ meta_key: topUpMarker, meta_value: topUpVersion, updated_at: new Date() }).onConflict('meta_key').merge();
}

async function countOf(db: Knex, characteristicId: number): Promise<number> {
  const [[{ n }]] = await db.raw('SELECT COUNT(*) AS n FROM measurements WHERE characteristic_id = ?', [characteristicId]) as [[{ n: number }]];
  return Number(n);
}

/** The control-chart API (HTTP, records:read token) for C01 with a million stored values (target ≤ 300 ms). */
export async function benchSpcChart(ctx: BenchContext, dataset: BenchDataset) {
  const c01 = dataset.characteristicIds[0];
  await topUpFirstCharacteristic(ctx, dataset);
  // The raw-ceiling ingest and the top-up write around the API, so the summary is rebuilt from the values.
  ctx.log('spc chart: rebuilding the display summary of C01…');
  const start = performance.now();
  await rebuildSpcDisplayBlocks(ctx.db, c01);
  const rebuildMs = performance.now() - start;
  const token = await clientToken(ctx.idpUrl, 'demo-integration', 'demo-integration-secret', 'records:read');
  let shown = { total: 0, buckets: [] as unknown[], points: [] as unknown[] };
  let bytes = 0;
  const fetchChart = async () => {
    const response = await fetch(`${ctx.app.url}/api/v1/spc/characteristics/${c01}/chart`, { headers: { authorization: `Bearer ${token}` } });
    const text = await response.text();
    if (response.status !== 200) throw new Error(`chart answered ${response.status}: ${text}`);
    bytes = text.length;
    shown = JSON.parse(text);
  };
  await fetchChart();
  const ms = await medianMs(fetchChart, 15);
  return {
    storedValues: await countOf(ctx.db, c01), chartTotal: shown.total, buckets: shown.buckets.length, exactPoints: shown.points.length,
    responseKb: round(bytes / 1024, 1), chartMedianMs: ms, rebuildSummaryMs: round(rebuildMs, 0), target: '≤ 300 ms',
  };
}
