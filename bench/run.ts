// The benchmark: builds (once) the plant-scale set and measures each target beside its ceiling.
// Sections: `npm run bench -- ingest` runs one; no argument runs all. Results are written after
// every section, so a long run that is stopped keeps what it measured.
import { mkdirSync, writeFileSync, existsSync, readFileSync } from 'node:fs';
import { spawn } from 'node:child_process';
import { ensureBenchDataset, type BenchDataset } from './dataset.js';
import { startBenchApp, type BenchContext } from './harness.js';
import { benchIngest } from './ingest.js';
import { benchSpcRules } from './spc-rules.js';
import { benchAuditChain } from './audit-chain.js';
import { benchAnalysis } from './analysis.js';
import { benchYield } from './yield.js';
import { benchSpcChart } from './spc-chart.js';
import { benchIngestWithRules } from './spc-ingest.js';
import { benchIngestWithWaveforms } from './ingest-waveforms.js';
import { benchMotorsList } from './motors-list.js';
import { waitForQuietMachine } from './stats.js';

const log = (line: string) => console.log(`[bench] ${line}`);
const wanted = process.argv.slice(2);
const resultsFile = 'bench/results/latest.json';
const previous = existsSync(resultsFile) ? JSON.parse(readFileSync(resultsFile, 'utf8')) : {};
const results: Record<string, unknown> = { ...previous, machine: { cores: 2, node: process.version } };

type Section = { name: string; key: string; run: (ctx: BenchContext, dataset: BenchDataset) => Promise<unknown> };
const sections: Section[] = [
  { name: 'ingest', key: 'ingest', run: (ctx, dataset) => benchIngest(ctx, dataset, String(25 + (Date.now() % 75))) },
  { name: 'ingest-waveforms', key: 'ingestWithWaveforms', run: benchIngestWithWaveforms },
  { name: 'analysis', key: 'analysis', run: async () => ({ ...(await benchAnalysis()), target: '≤ 20 ms for analyzeBackEmf' }) },
  { name: 'spc', key: 'spcRules', run: () => benchSpcRules() },
  { name: 'spc-chart', key: 'spcChart', run: benchSpcChart },
  { name: 'spc-ingest', key: 'spcIngest', run: benchIngestWithRules },
  { name: 'yield', key: 'yield', run: benchYield },
  { name: 'motors-list', key: 'motorsList', run: benchMotorsList },
  { name: 'evidence', key: 'evidencePack', run: () => inOwnProcess('bench/evidence-process.ts') },
  { name: 'audit', key: 'auditChain', run: (ctx) => benchAuditChain(ctx) },
];

/** Runs a section's script in a fresh process with this process's Node flags; resolves with the JSON it prints. */
function inOwnProcess(script: string): Promise<unknown> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [...process.execArgv, script], { stdio: ['ignore', 'pipe', 'inherit'] });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => { output += chunk.toString(); });
    child.once('error', reject);
    // 'close', not 'exit': only then has all of its output arrived. The figures are its last line.
    child.once('close', (code) => {
      if (code !== 0) return reject(new Error(`${script} exited with code ${code}`));
      const lines = output.trim().split('\n');
      resolve(JSON.parse(lines[lines.length - 1]));
    });
  });
}

function save() {
  mkdirSync('bench/results', { recursive: true });
  writeFileSync(resultsFile, JSON.stringify(results, null, 2));
}

const ctx = await startBenchApp(log);
try {
  const dataset = await ensureBenchDataset(ctx.db, log);
  const measurementCount = await ctx.db('measurements').count({ n: '*' }).first();
  results.dataset = { motors: dataset.motors, measurements: Number(measurementCount?.n ?? 0) };
  for (const section of sections) {
    if (wanted.length > 0 && !wanted.includes(section.name)) continue;
    const waitedMs = await waitForQuietMachine();
    if (waitedMs > 1500) log(`${section.name}: waited ${(waitedMs / 1000).toFixed(0)} s for the machine to settle`);
    results[section.key] = { ...(await section.run(ctx, dataset) as object), measuredAt: new Date().toISOString() };
    save();
  }
} finally {
  await ctx.stop();
}
console.log(JSON.stringify(results, null, 2));
