import type { Knex } from 'knex';
import type { Statement } from '../../db/statements.js';

/** Run ids per display block: small enough that a window's ragged edges are cheap to read raw. */
export const blockRunSpan = 256;

export const blockOf = (runId: number) => Math.floor(runId / blockRunSpan);

export type DisplayBlock = { blockNo: number; firstRunId: number; lastRunId: number; n: number; sum: number; min: number; max: number };

export type DisplayPoint = { runId: number; characteristicId: number; value: number };

/**
 * The statement that adds freshly stored values to the display summary, inside the ingest
 * transaction: one multi-row upsert per batch of runs, the values of each (characteristic, block)
 * summed first. Rows go in (characteristic, block) order so concurrent ingests that share a block
 * lock its rows in the same order and queue, not deadlock. Null when there is nothing to add.
 */
export function displayBlocksStatement(points: readonly DisplayPoint[]): Statement | null {
  if (points.length === 0) return null;
  const blocks = new Map<string, { characteristicId: number; blockNo: number; first: number; last: number; n: number; sum: number; sumSq: number; min: number; max: number }>();
  for (const { runId, characteristicId, value } of points) {
    const blockNo = blockOf(runId);
    const key = `${characteristicId}:${blockNo}`;
    const block = blocks.get(key);
    if (!block) {
      blocks.set(key, { characteristicId, blockNo, first: runId, last: runId, n: 1, sum: value, sumSq: value * value, min: value, max: value });
      continue;
    }
    block.first = Math.min(block.first, runId);
    block.last = Math.max(block.last, runId);
    block.n += 1;
    block.sum += value;
    block.sumSq += value * value;
    block.min = Math.min(block.min, value);
    block.max = Math.max(block.max, value);
  }
  const sorted = [...blocks.values()].sort((a, b) => a.characteristicId - b.characteristicId || a.blockNo - b.blockNo);
  return {
    sql: `INSERT INTO spc_display_blocks (characteristic_id, block_no, first_run_id, last_run_id, n, sum, sum_sq, min_value, max_value)
     VALUES ${sorted.map(() => '(?,?,?,?,?,?,?,?,?)').join(',')}
     ON DUPLICATE KEY UPDATE first_run_id = LEAST(first_run_id, VALUES(first_run_id)), last_run_id = GREATEST(last_run_id, VALUES(last_run_id)),
       n = n + VALUES(n), sum = sum + VALUES(sum), sum_sq = sum_sq + VALUES(sum_sq),
       min_value = LEAST(min_value, VALUES(min_value)), max_value = GREATEST(max_value, VALUES(max_value))`,
    bindings: sorted.flatMap((b) => [b.characteristicId, b.blockNo, b.first, b.last, b.n, b.sum, b.sumSq, b.min, b.max]),
  };
}

/**
 * Recomputes the summary from the stored values, for data written around ingest (the migration,
 * bulk loads): one characteristic, or every characteristic one after the other so each pass reads
 * only its own stretch of the covering index.
 */
export async function rebuildSpcDisplayBlocks(db: Knex, characteristicId?: number): Promise<void> {
  const ids = characteristicId !== undefined
    ? [characteristicId]
    : (await db('characteristics').orderBy('id').select('id')).map((row: { id: number }) => row.id);
  for (const id of ids) {
    await db.transaction(async (trx) => {
      await trx('spc_display_blocks').where({ characteristic_id: id }).delete();
      await trx.raw(
        `INSERT INTO spc_display_blocks (characteristic_id, block_no, first_run_id, last_run_id, n, sum, sum_sq, min_value, max_value)
         SELECT characteristic_id, run_id DIV ${blockRunSpan}, MIN(run_id), MAX(run_id), COUNT(*), SUM(value), SUM(value * value), MIN(value), MAX(value)
           FROM measurements FORCE INDEX (measurements_series)
          WHERE characteristic_id = ?
          GROUP BY characteristic_id, run_id DIV ${blockRunSpan}`,
        [id],
      );
    });
  }
}

/** The blocks lying wholly inside a run window, in run order. */
export async function readDisplayBlocks(db: Knex, characteristicId: number, fromBlock: number, toBlock: number): Promise<DisplayBlock[]> {
  if (fromBlock > toBlock) return [];
  const rows: Array<{ block_no: number; first_run_id: number | string; last_run_id: number | string; n: number; sum: number; min_value: number; max_value: number }> =
    await db('spc_display_blocks').where({ characteristic_id: characteristicId }).whereBetween('block_no', [fromBlock, toBlock])
      .orderBy('block_no').select('block_no', 'first_run_id', 'last_run_id', 'n', 'sum', 'min_value', 'max_value');
  return rows.map((r) => ({ blockNo: r.block_no, firstRunId: Number(r.first_run_id), lastRunId: Number(r.last_run_id), n: Number(r.n), sum: r.sum, min: r.min_value, max: r.max_value }));
}
