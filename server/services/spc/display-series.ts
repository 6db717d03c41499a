import type { Knex } from 'knex';
import { blockRunSpan, readDisplayBlocks, type DisplayBlock } from './display-blocks.js';
import { readValues, type RunRange, type SeriesValue } from './series.js';

/** Up to this many values the chart gets every value; beyond it, buckets plus the recent tail. */
export const exactDisplayLimit = 2000;
export const displayBuckets = 2000;
/** The newest values are always sent one by one: they are what the engineer is judging now. */
export const recentPoints = 500;

export type DisplayBucket = { fromRunId: number; toRunId: number; min: number; max: number; mean: number; n: number };
export type DisplaySeries = { total: number; sampled: boolean; buckets: DisplayBucket[]; points: SeriesValue[] };

function merged(blocks: readonly DisplayBlock[]): DisplayBucket {
  let n = 0; let sum = 0; let min = Infinity; let max = -Infinity;
  for (const b of blocks) { n += b.n; sum += b.sum; if (b.min < min) min = b.min; if (b.max > max) max = b.max; }
  return { fromRunId: blocks[0].firstRunId, toRunId: blocks[blocks.length - 1].lastRunId, min, max, mean: sum / n, n };
}

function bucketOfValues(values: readonly SeriesValue[]): DisplayBucket {
  return merged([{ blockNo: 0, firstRunId: values[0].runId, lastRunId: values[values.length - 1].runId, n: values.length,
    sum: values.reduce((s, v) => s + v.value, 0), min: Math.min(...values.map((v) => v.value)), max: Math.max(...values.map((v) => v.value)) }]);
}

/** Consecutive blocks in equal-sized groups, each group one bucket, so the x spacing stays even. */
function bucketsOf(blocks: readonly DisplayBlock[]): DisplayBucket[] {
  const per = Math.ceil(blocks.length / displayBuckets);
  const buckets: DisplayBucket[] = [];
  for (let i = 0; i < blocks.length; i += per) buckets.push(merged(blocks.slice(i, i + per)));
  return buckets;
}

/**
 * What the chart draws for a run window. The whole blocks inside it come from the display
 * summary; the partial block at the window's start is read raw into one bucket of its own, and
 * the newest blocks (at least recentPoints values) together with the partial block at the end are
 * read raw and sent as exact points. The summary is never used for statistics: they read values.
 */
export async function displaySeries(db: Knex, characteristicId: number, range: RunRange): Promise<DisplaySeries> {
  const fromBlock = Math.ceil(range.fromRunId / blockRunSpan);
  const toBlock = Math.floor((range.toRunId + 1) / blockRunSpan) - 1;
  if (fromBlock > toBlock) return exactly(await readValues(db, characteristicId, range));
  const innerFrom = fromBlock * blockRunSpan;
  const innerTo = (toBlock + 1) * blockRunSpan - 1;
  const [blocks, head, end] = await Promise.all([
    readDisplayBlocks(db, characteristicId, fromBlock, toBlock),
    range.fromRunId < innerFrom ? readValues(db, characteristicId, { fromRunId: range.fromRunId, toRunId: innerFrom - 1 }) : [],
    range.toRunId > innerTo ? readValues(db, characteristicId, { fromRunId: innerTo + 1, toRunId: range.toRunId }) : [],
  ]);
  const total = blocks.reduce((s, b) => s + b.n, 0) + head.length + end.length;
  if (total <= exactDisplayLimit) return exactly(await readValues(db, characteristicId, range));
  let tailStart = blocks.length;
  for (let inTail = end.length; tailStart > 0 && inTail < recentPoints; ) inTail += blocks[--tailStart].n;
  const tail = tailStart < blocks.length
    ? await readValues(db, characteristicId, { fromRunId: blocks[tailStart].firstRunId, toRunId: blocks[blocks.length - 1].lastRunId })
    : [];
  const buckets = [...(head.length > 0 ? [bucketOfValues(head)] : []), ...bucketsOf(blocks.slice(0, tailStart))];
  return { total, sampled: true, buckets, points: [...tail, ...end] };
}

const exactly = (points: SeriesValue[]): DisplaySeries => ({ total: points.length, sampled: false, buckets: [], points });
