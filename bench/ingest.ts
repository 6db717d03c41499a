import { randomUUID } from 'node:crypto';
import { spawn } from 'node:child_process';
import { benchCharacteristicCode, benchProductCode, type BenchDataset } from './dataset.js';
import { clientToken, type BenchContext } from './harness.js';
import { cpuByProcessMs, inControlValues, machineBusyCpuMs, percentile, round, runPool } from './stats.js';
import { connectStands, httpRequest } from './http-client.js';

const runsPerMeasurement = 4000;
const concurrentStations = 16;
const rounds = 4;

const nextValue = inControlValues(7);

export function runDocument(serial: string, stationCode: string, lotCode: string, startedAt: Date) {
  return {
    runId: randomUUID(), serial, product: benchProductCode, station: stationCode, lot: lotCode,
    startedAt: startedAt.toISOString(), finishedAt: new Date(startedAt.getTime() + 1000).toISOString(),
    operatorBadge: 'B-0002', programVersion: 'bench-1',
    results: Array.from({ length: 40 }, (_, i) => ({ characteristic: benchCharacteristicCode(i), value: nextValue(), unit: 'V' })),
  };
}

/**
 * Starts bench/lookup-client.ts; `start()` waits until it has loaded, then sets it looking up;
 * `stop()` ends it and resolves with the latencies it measured.
 */
function lookupClient(appUrl: string, token: string, serials: string[]) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'bench/lookup-client.ts', appUrl, token], { stdio: ['pipe', 'pipe', 'inherit'] });
  let output = '';
  let onReady: () => void = () => undefined;
  const ready = new Promise<void>((resolve) => { onReady = resolve; });
  child.stdout.on('data', (chunk: Buffer) => {
    output += chunk.toString();
    if (output.startsWith('ready\n')) onReady();
  });
  const exited = new Promise<number | null>((resolve) => child.once('exit', resolve));
  return {
    async start(): Promise<void> {
      await ready;
      child.stdin.write(`${JSON.stringify(serials)}\n`);
    },
    async stop(): Promise<number[]> {
      child.stdin.end('stop\n');
      const code = await exited;
      if (code !== 0) throw new Error(`the look-up client exited with code ${code}`);
      return JSON.parse(output.slice('ready\n'.length)) as number[];
    },
  };
}

/** API ingest (HTTP, 16 concurrent) beside the raw ceiling (knex, 40 rows per transaction, 16 connections). */
export async function benchIngest(ctx: BenchContext, dataset: BenchDataset, tag: string) {
  const station = await ctx.db('stations').where({ id: dataset.stationIds[0] }).first();
  await ctx.db('station_clients').insert({ client_id: 'demo-station', station_id: station.id }).onConflict('client_id').merge();
  const lot = await ctx.db('lots').where({ product_id: dataset.productId }).orderBy('id', 'desc').first();
  const token = await clientToken(ctx.idpUrl, 'demo-station', 'demo-station-secret', 'test-runs:write');
  const readToken = await clientToken(ctx.idpUrl, 'demo-integration', 'demo-integration-secret', 'records:read');
  const base = Date.now() - 3_600_000;
  let stands = await connectStands(ctx.app.url, concurrentStations);
  const post = async (i: number, prefix: string, lane: number) => {
    const document = runDocument(`BX${prefix}-${String(i).padStart(5, '0')}`, station.code, lot.code, new Date(base + i));
    const response = await httpRequest(`${ctx.app.url}/api/v1/test-runs`, { token, json: document, stand: stands[lane] });
    if (response.status !== 201) throw new Error(`ingest answered ${response.status}: ${response.body}`);
    answerJson ??= response.body;
  };
  let answerJson: string | undefined;

  // An uncounted warm-up round first, so the figure is the steady state, not JIT and cold caches.
  ctx.log('ingest: warm-up round…');
  await runPool(1000, concurrentStations, (i, lane) => post(i, `${tag}2`, lane));
  const motorIds = (await ctx.db('motors').where({ lot_id: lot.id }).select('id').limit(runsPerMeasurement)).map((m) => m.id);
  const maxAttempt = await ctx.db('test_runs').where({ lot_id: lot.id }).max({ n: 'attempt' }).first();
  const attemptBase = Number(maxAttempt?.n ?? 0) + 1;
  // The raw ceiling writes the rows the API writes for a run: its test_runs row (with the stored
  // answer a retry gets back, as the API wrote it) and its 40 measurements, one transaction a run.
  const storeRaw = async (i: number) => {
    await ctx.db.transaction(async (trx) => {
      const [runId] = await trx('test_runs').insert({
        run_uuid: randomUUID(), motor_id: motorIds[i % motorIds.length], station_id: station.id, lot_id: lot.id,
        attempt: attemptBase + i, started_at: new Date(), finished_at: new Date(), operator_badge: 'B-0003',
        program_version: 'bench-1', limit_set_id: dataset.limitSetId, verdict: 'pass', calibration_ok: true, calibration_due: '2099-01-01',
        body_sha256: '0'.repeat(64), response_json: answerJson, source: 'station', received_at: new Date(),
      });
      await trx('measurements').insert(dataset.characteristicIds.map((id) => ({ run_id: runId, characteristic_id: id, value: nextValue(), lsl: 90, usl: 110, verdict: 'pass' })));
    });
  };

  // API and raw ceiling take turns, a quarter of the runs each time, so that both meet the same
  // moments of a shared machine (whose speed drifts by tens of percent within minutes).
  ctx.log(`ingest: ${runsPerMeasurement} runs through the API and the same rows through knex directly (raw ceiling), ${concurrentStations} concurrent, in ${rounds} alternating rounds…`);
  const api = { seconds: 0, cpuMs: 0, mariadb: 0, app: 0, bench: 0 };
  const raw = { seconds: 0, cpuMs: 0, mariadb: 0, app: 0, bench: 0 };
  const perRound = runsPerMeasurement / rounds;
  const measure = async (into: typeof api, work: () => Promise<void>) => {
    const start = performance.now();
    const cpuStart = machineBusyCpuMs();
    const byProcessStart = cpuByProcessMs();
    await work();
    into.seconds += (performance.now() - start) / 1000;
    into.cpuMs += machineBusyCpuMs() - cpuStart;
    const byProcess = cpuByProcessMs();
    into.mariadb += byProcess.mariadb - byProcessStart.mariadb;
    into.app += byProcess.app - byProcessStart.app;
    into.bench += byProcess.bench - byProcessStart.bench;
  };
  for (let round = 0; round < rounds; round++) {
    const offset = round * perRound;
    await measure(api, () => runPool(perRound, concurrentStations, (i, lane) => post(offset + i, `${tag}0`, lane)));
    await measure(raw, () => runPool(perRound, concurrentStations, (i) => storeRaw(offset + i)));
  }
  const apiRunsPerS = runsPerMeasurement / api.seconds;
  const rawRunsPerS = runsPerMeasurement / raw.seconds;
  const apiCpuMsPerRun = api.cpuMs / runsPerMeasurement;
  const rawCpuMsPerRun = raw.cpuMs / runsPerMeasurement;

  ctx.log('look-up: serials through the API while ingest runs…');
  const serials = (await ctx.db('motors').where({ product_id: dataset.productId }).orderByRaw('RAND()').limit(500).select('serial')).map((m) => m.serial);
  stands = await connectStands(ctx.app.url, concurrentStations);
  const lookups = lookupClient(ctx.app.url, readToken, serials);
  await lookups.start();
  await runPool(runsPerMeasurement, concurrentStations, (i, lane) => post(i, `${tag}1`, lane));
  const latencies = await lookups.stop();
  return {
    apiRunsPerS: round(apiRunsPerS, 1),
    rawRunsPerS: round(rawRunsPerS, 1),
    apiToRawRatio: round(apiRunsPerS / rawRunsPerS, 3),
    // CPU of the whole machine per run (app, MariaDB and the benchmark's clients together).
    machineCpuMsPerRun: { api: round(apiCpuMsPerRun), raw: round(rawCpuMsPerRun) },
    // The same, by process: where the CPU went (the rest is the kernel and other processes).
    cpuMsPerRunByProcess: {
      api: { mariadb: round(api.mariadb / runsPerMeasurement), app: round(api.app / runsPerMeasurement), bench: round(api.bench / runsPerMeasurement) },
      raw: { mariadb: round(raw.mariadb / runsPerMeasurement), app: round(raw.app / runsPerMeasurement), bench: round(raw.bench / runsPerMeasurement) },
    },
    lookupUnderIngestMs: { samples: latencies.length, p50: round(percentile(latencies, 50)), p95: round(percentile(latencies, 95)), p99: round(percentile(latencies, 99)) },
    targets: { apiToRawRatio: '≥ 0.60', lookupP95Ms: '≤ 25' },
  };
}
