// The benchmark: builds (once) the plant-scale set and measures each target beside its ceiling.
// Sections: `npm run bench -- ingest` runs one; no argument runs all.
import { mkdirSync, writeFileSync, existsSync, readFileSync } from 'node:fs';
import { ensureBenchDataset } from './dataset.js';
import { startBenchApp } from './harness.js';
import { benchIngest } from './ingest.js';
import { benchSpcRules } from './spc-rules.js';
import { benchEvidencePack } from './evidence.js';
import { benchAuditChain } from './audit-chain.js';
import { benchAnalysis } from './analysis.js';
import { benchYield } from './yield.js';

const log = (line: string) => console.log(`[bench] ${line}`);
const wanted = process.argv.slice(2);
const runs = (name: string) => wanted.length === 0 || wanted.includes(name);
const resultsFile = 'bench/results/latest.json';
const previous = existsSync(resultsFile) ? JSON.parse(readFileSync(resultsFile, 'utf8')) : {};
const results: Record<string, unknown> = { ...previous, machine: { cores: 2, node: process.version } };

const ctx = await startBenchApp(log);
try {
  const dataset = await ensureBenchDataset(ctx.db, log);
  const measurementCount = await ctx.db('measurements').count({ n: '*' }).first();
  results.dataset = { motors: dataset.motors, measurements: Number(measurementCount?.n ?? 0) };
  if (runs('ingest')) results.ingest = await benchIngest(ctx, dataset, String(25 + (Date.now() % 75)));
  if (runs('analysis')) results.analysis = { ...(await benchAnalysis()), target: '≤ 20 ms for analyzeBackEmf' };
  if (runs('spc')) results.spcRules = await benchSpcRules();
  if (runs('spc-chart')) results.spcChart = await (await import('./spc-chart.js')).benchSpcChart(ctx, dataset);
  if (runs('spc-ingest')) results.spcIngest = await (await import('./spc-ingest.js')).benchIngestWithRules(ctx, dataset);
  if (runs('yield')) results.yield = await benchYield(ctx, dataset);
  if (runs('evidence')) results.evidencePack = await benchEvidencePack(ctx);
  if (runs('audit')) results.auditChain = await benchAuditChain(ctx);
  results.measuredAt = new Date().toISOString();
} finally {
  await ctx.stop();
}
mkdirSync('bench/results', { recursive: true });
writeFileSync(resultsFile, JSON.stringify(results, null, 2));
console.log(JSON.stringify(results, null, 2));
