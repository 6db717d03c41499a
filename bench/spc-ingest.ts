import { randomUUID } from 'node:crypto';
import type { SessionUser } from '../server/auth/session.js';
import { listCharacteristics, updateCharacteristic } from '../server/services/setup/characteristics.js';
import { computeTrialLimits } from '../server/services/spc/compute-trial-limits.js';
import { freezeControlLimits } from '../server/services/spc/freeze-control-limits.js';
import { benchCharacteristicCode, benchProductCode, type BenchDataset } from './dataset.js';
import { clientToken, type BenchContext } from './harness.js';
import { inControlValues, round, runPool } from './stats.js';
import { connectStands, httpRequest } from './http-client.js';

const runsPerRound = 1000;
const concurrentStations = 16;
const judged = [0, 1, 2, 3].map(benchCharacteristicCode);
const benchQuality: SessionUser = { id: 0, subject: 'bench-quality', name: 'Benchmark (quality)', email: 'bench-quality@plant.example', role: 'quality' };

/** Individuals limits from the first 30 days of each judged characteristic, frozen (audited) by the service. */
async function freezeJudgedLimits(ctx: BenchContext, dataset: BenchDataset): Promise<void> {
  const first = await ctx.db('test_runs').where({ program_version: 'bench-1' }).orderBy('id').first('started_at');
  const from = new Date(first.started_at);
  const to = new Date(from.getTime() + 30 * 86_400_000);
  for (const id of dataset.characteristicIds.slice(0, judged.length)) {
    const trial = await computeTrialLimits(ctx.db, benchQuality, id, { chartKind: 'individuals', from, to });
    await freezeControlLimits(ctx.db, benchQuality, trial.id);
  }
}

/** Rules on or off through Setup's own (audited) characteristic update. */
async function setRules(ctx: BenchContext, on: boolean): Promise<void> {
  const rows = (await listCharacteristics(ctx.db, benchProductCode)).filter((c) => judged.includes(c.code));
  for (const c of rows) {
    await updateCharacteristic(ctx.db, benchQuality, benchProductCode, c.code, {
      name: c.name, unit: c.unit, testStep: c.testStep, spcEnabled: on, subgroupMode: c.subgroupMode as 'individual', subgroupSize: c.subgroupSize,
      sortOrder: c.sortOrder, reason: on ? 'Benchmark: rules on' : 'Benchmark: rules off for the comparison',
    });
  }
}

/**
 * API ingest runs/s with the SPC rules judging C01–C04 against frozen individuals limits, beside
 * the same ingest with SPC off for them (target ≥ 90 %). After an uncounted warm-up, rounds
 * alternate off, on, on, off so neither side gets the warmer cache.
 */
export async function benchIngestWithRules(ctx: BenchContext, dataset: BenchDataset) {
  // Two digits of the serial, so each bench run posts new motors (the pattern is BX + 3 digits).
  const tag = String(25 + (Date.now() % 75));
  const station = await ctx.db('stations').where({ id: dataset.stationIds[0] }).first();
  await ctx.db('station_clients').insert({ client_id: 'demo-station', station_id: station.id }).onConflict('client_id').merge();
  const lot = await ctx.db('lots').where({ product_id: dataset.productId }).orderBy('id', 'desc').first();
  const token = await clientToken(ctx.idpUrl, 'demo-station', 'demo-station-secret', 'test-runs:write');
  ctx.log('spc ingest: freezing individuals limits for C01–C04…');
  await freezeJudgedLimits(ctx, dataset);
  const next = inControlValues(11);
  const base = Date.now() - 1_800_000;
  const round_ = async (prefix: string) => {
    const stands = await connectStands(ctx.app.url, concurrentStations);
    const start = performance.now();
    await runPool(runsPerRound, concurrentStations, async (i, lane) => {
      const startedAt = new Date(base + i);
      const document = {
        runId: randomUUID(), serial: `BX${prefix}-${String(i).padStart(5, '0')}`, product: benchProductCode, station: station.code, lot: lot.code,
        startedAt: startedAt.toISOString(), finishedAt: new Date(startedAt.getTime() + 1000).toISOString(), operatorBadge: 'B-0004', programVersion: 'bench-1',
        results: Array.from({ length: 40 }, (_, k) => ({ characteristic: benchCharacteristicCode(k), value: next(), unit: 'V' })),
      };
      const response = await httpRequest(`${ctx.app.url}/api/v1/test-runs`, { token, json: document, stand: stands[lane] });
      if (response.status !== 201) throw new Error(`ingest answered ${response.status}: ${response.body}`);
    });
    return runsPerRound / ((performance.now() - start) / 1000);
  };
  const figures = { off: [] as number[], on: [] as number[] };
  const signalsBefore = Number((await ctx.db('signals').count({ n: '*' }).first())?.n ?? 0);
  ctx.log('spc ingest: a warm-up round, not counted…');
  await setRules(ctx, true);
  await round_(`${tag}4`);
  for (const [k, side] of (['off', 'on', 'on', 'off'] as const).entries()) {
    ctx.log(`spc ingest: ${runsPerRound} runs with rules ${side}…`);
    await setRules(ctx, side === 'on');
    figures[side].push(await round_(`${tag}${k + 5}`));
  }
  await setRules(ctx, true);
  const signalsOpened = Number((await ctx.db('signals').count({ n: '*' }).first())?.n ?? 0) - signalsBefore;
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  return {
    runsPerRound, concurrentStations, rulesOnRunsPerS: round(mean(figures.on), 1), rulesOffRunsPerS: round(mean(figures.off), 1),
    onToOffRatio: round(mean(figures.on) / mean(figures.off), 3), rounds: figures, signalsOpened, target: 'on ≥ 0.90 × off',
  };
}
