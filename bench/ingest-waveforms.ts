import { syntheticSpin } from '../tests/support/synthetic-back-emf.js';
import { connectStands, httpRequest } from './http-client.js';
import type { BenchDataset } from './dataset.js';
import { clientToken, type BenchContext } from './harness.js';
import { runDocument } from './ingest.js';
import { round, runPool } from './stats.js';

const runs = 500;
const concurrentStations = 16;

/**
 * API ingest of runs that each carry a back-EMF spin (3 × 4,096 samples at 20 kHz with a
 * resolver channel): analysed on ingest, samples kept in the blob store — beside the plain
 * ingest figure of the `ingest` section.
 */
export async function benchIngestWithWaveforms(ctx: BenchContext, dataset: BenchDataset) {
  const station = await ctx.db('stations').where({ id: dataset.stationIds[0] }).first();
  await ctx.db('station_clients').insert({ client_id: 'demo-station', station_id: station.id }).onConflict('client_id').merge();
  const lot = await ctx.db('lots').where({ product_id: dataset.productId }).orderBy('id', 'desc').first();
  const token = await clientToken(ctx.idpUrl, 'demo-station', 'demo-station-secret', 'test-runs:write');
  const spin = syntheticSpin({ sampleRateHz: 20_000, speedRpm: 1000, polePairs: 4, samples: 4096, harmonicsPeakV: { 1: 68, 5: 2, 7: 1 }, resolverOffsetDeg: 12 });
  const tag = String(25 + (Date.now() % 75));
  const base = Date.now() - 3_600_000;
  const stands = await connectStands(ctx.app.url, concurrentStations);
  const post = async (i: number, lane: number) => {
    const document = { ...runDocument(`BX${tag}3-${String(i).padStart(5, '0')}`, station.code, lot.code, new Date(base + i)), waveforms: [spin] };
    const response = await httpRequest(`${ctx.app.url}/api/v1/test-runs`, { token, json: document, stand: stands[lane] });
    if (response.status !== 201) throw new Error(`ingest with a waveform answered ${response.status}: ${response.body}`);
  };
  ctx.log(`ingest with waveforms: ${runs} runs, ${concurrentStations} concurrent…`);
  const start = performance.now();
  await runPool(runs, concurrentStations, post);
  const runsPerS = runs / ((performance.now() - start) / 1000);
  return { runs, samplesPerChannel: 4096, runsPerS: round(runsPerS, 1) };
}
