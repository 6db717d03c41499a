// The serial look-ups of the ingest benchmark, in a process of their own: in a plant the scanning
// operator is not on the stands' machines, so the look-ups must not wait in the event loop of the
// sixteen stand clients (which build and parse 40-result documents) — only for the shared CPU.
// Args: app URL, bearer token. Prints "ready" once loaded; the serials then arrive as one JSON
// line on stdin, and the look-ups start at once and stop when a line "stop" arrives and at least
// `minSamples` were taken. The latencies (ms) go to stdout as one JSON line.
import { createInterface } from 'node:readline';
import { httpRequest } from './http-client.js';

const [appUrl, token] = process.argv.slice(2);
const minSamples = 200;

const lines = createInterface({ input: process.stdin });
const iterator = lines[Symbol.asyncIterator]();
process.stdout.write('ready\n');
const serials = JSON.parse((await iterator.next()).value as string) as string[];
let stopping = false;
void iterator.next().then(() => { stopping = true; });

const latencies: number[] = [];
for (let i = 0; !stopping || i < minSamples; i++) {
  const t0 = performance.now();
  const response = await httpRequest(`${appUrl}/api/v1/motors/${serials[i % serials.length]}`, { token });
  if (response.status !== 200) throw new Error(`look-up answered ${response.status}`);
  latencies.push(performance.now() - t0);
}
process.stdout.write(`${JSON.stringify(latencies)}\n`);
lines.close();
