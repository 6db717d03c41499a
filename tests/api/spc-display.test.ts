import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { blockRunSpan, rebuildSpcDisplayBlocks } from '../../server/services/spc/display-blocks.js';
import { createPlant, runDocument, type PlantFixture } from '../factories.js';

type Aggregate = { characteristic_id: number; block_no: number; n: number; min_value: number; max_value: number; first_run_id: number; last_run_id: number };

/** A value that wanders, so neighbouring blocks have different extremes. */
const valueAt = (i: number) => 50 + Math.sin(i / 17) * 0.8 + ((i * 7919) % 13) / 50;

describe('SPC display summary: blocks kept on ingest and rebuilt from the stored values', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let quality: string;
  const ke = () => plant.product.characteristics.find((c) => c.code === 'bemf.ke')!.id;

  const summary = async (): Promise<Aggregate[]> => (await server.db('spc_display_blocks').orderBy(['characteristic_id', 'block_no'])
    .select('characteristic_id', 'block_no', 'n', 'min_value', 'max_value', 'first_run_id', 'last_run_id')).map(normalise);
  const fromRawValues = async (): Promise<Aggregate[]> => {
    const [rows] = await server.db.raw(
      `SELECT characteristic_id, run_id DIV ? AS block_no, COUNT(*) AS n, MIN(value) AS min_value, MAX(value) AS max_value, MIN(run_id) AS first_run_id, MAX(run_id) AS last_run_id
         FROM measurements GROUP BY characteristic_id, run_id DIV ? ORDER BY characteristic_id, block_no`, [blockRunSpan, blockRunSpan]) as [Aggregate[]];
    return rows.map(normalise);
  };
  const normalise = (r: Aggregate): Aggregate => ({ characteristic_id: r.characteristic_id, block_no: Number(r.block_no), n: Number(r.n), min_value: r.min_value, max_value: r.max_value, first_run_id: Number(r.first_run_id), last_run_id: Number(r.last_run_id) });

  async function ingestMany(count: number, offset = 0) {
    // Four at a time, as stands post concurrently: the shared block rows must still add up.
    for (let i = 0; i < count; i += 4) {
      await Promise.all(Array.from({ length: Math.min(4, count - i) }, async (_, k) => {
        const document = runDocument(plant);
        document.results = document.results.map((r) => (r.characteristic === 'bemf.ke' ? { ...r, value: valueAt(offset + i + k) } : r));
        await ingestTestRun(server.db, document);
      }));
    }
  }

  /** Bulk-loaded runs of one motor, as a migration or import would write them around ingest. */
  async function bulkLoad(count: number, startedFrom: Date) {
    const motor = await server.db('motors').first('id');
    const runs = Array.from({ length: count }, (_, i) => ({
      run_uuid: randomUUID(), motor_id: motor.id, station_id: plant.station.id, lot_id: plant.lot.id, attempt: 1000 + i,
      started_at: new Date(startedFrom.getTime() + i * 1000), finished_at: new Date(startedFrom.getTime() + i * 1000 + 500),
      operator_badge: 'B-1042', program_version: 'bulk', limit_set_id: plant.limitSet.id, verdict: 'pass', calibration_ok: true,
      calibration_due: '2099-01-01', body_sha256: '0'.repeat(64), response_json: '{}', source: 'station', received_at: new Date(),
    }));
    await server.db.batchInsert('test_runs', runs, 1000);
    const ids = (await server.db('test_runs').where({ program_version: 'bulk' }).orderBy('id').select('id')).map((r) => Number(r.id));
    await server.db.batchInsert('measurements', ids.map((runId, i) => ({ run_id: runId, characteristic_id: ke(), value: valueAt(i), lsl: 48, usl: 52, verdict: 'pass' })), 1000);
  }

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db);
    quality = (await signIn(server.url, 'quality')).cookie;
  });

  it('when runs spanning several blocks are ingested concurrently, then every block holds the count, min, max and run span of its stored values', async () => {
    await ingestMany(3 * blockRunSpan + 40);
    const blocks = await summary();
    expect(new Set(blocks.filter((b) => b.characteristic_id === ke()).map((b) => b.block_no)).size).toBeGreaterThanOrEqual(3);
    expect(blocks).toEqual(await fromRawValues());
  });

  it('when values were bulk-loaded and the summary rebuilt, then each chart bucket equals the raw values of its run span and the newest values come exactly', async () => {
    await ingestMany(8);
    await bulkLoad(6000, new Date(Date.now() - 86_400_000));
    expect(await summary()).not.toEqual(await fromRawValues());
    await rebuildSpcDisplayBlocks(server.db, ke());
    expect(await summary()).toEqual(await fromRawValues());

    const chart = (await request(server.url).get(`/api/v1/spc/characteristics/${ke()}/chart`).set('cookie', quality).expect(200)).body;
    const raw: Array<{ run_id: number; value: number }> = await server.db('measurements').where({ characteristic_id: ke() }).orderBy('run_id').select('run_id', 'value');
    expect(chart.sampled).toBe(true);
    expect(chart.total).toBe(raw.length);
    expect(chart.points.length).toBeGreaterThanOrEqual(500);
    expect(chart.points).toEqual(raw.slice(raw.length - chart.points.length).map((r) => ({ runId: Number(r.run_id), value: r.value })));
    for (const bucket of chart.buckets as Array<{ fromRunId: number; toRunId: number; min: number; max: number; n: number }>) {
      const inSpan = raw.filter((r) => r.run_id >= bucket.fromRunId && r.run_id <= bucket.toRunId).map((r) => r.value);
      expect({ n: bucket.n, min: bucket.min, max: bucket.max }).toEqual({ n: inSpan.length, min: Math.min(...inSpan), max: Math.max(...inSpan) });
    }
    expect(chart.buckets.reduce((s: number, b: { n: number }) => s + b.n, 0) + chart.points.length).toBe(raw.length);
  });

  it('when the window starts inside a block, then the first bucket holds exactly the values from the window start to the next block', async () => {
    const start = new Date(Date.now() - 86_400_000);
    await ingestMany(1);
    await bulkLoad(4000, start);
    await rebuildSpcDisplayBlocks(server.db, ke());
    const from = new Date(start.getTime() + 1000 * 1000 + 300).toISOString();
    const chart = (await request(server.url).get(`/api/v1/spc/characteristics/${ke()}/chart`).query({ from }).set('cookie', quality).expect(200)).body;
    // A window is a run-id window from the first run started at or after its start.
    const firstRun = await server.db('test_runs').where('started_at', '>=', new Date(from)).orderBy('started_at').first('id');
    const raw: Array<{ run_id: number; value: number }> = await server.db('measurements').where({ characteristic_id: ke() })
      .andWhere('run_id', '>=', firstRun.id).orderBy('run_id').select('run_id', 'value');
    expect(chart.total).toBe(raw.length);
    const first = chart.buckets[0];
    expect(first.fromRunId).toBe(Number(raw[0].run_id));
    const head = raw.filter((r) => r.run_id <= first.toRunId).map((r) => r.value);
    expect(head.length).toBeLessThan(blockRunSpan);
    expect({ n: first.n, min: first.min, max: first.max }).toEqual({ n: head.length, min: Math.min(...head), max: Math.max(...head) });
  });
});
