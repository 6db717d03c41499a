import type { Knex } from 'knex';

/** Run ids per display block: small enough that a window's ragged edges are cheap to read raw. */
export const blockRunSpan = 256;

export const blockOf = (runId: number) => Math.floor(runId / blockRunSpan);

export type DisplayBlock = { blockNo: number; firstRunId: number; lastRunId: number; n: number; sum: number; min: number; max: number };

/**
 * Adds one run's values to the display summary, inside the ingest transaction: a single
 * multi-row upsert whatever the number of characteristics. Rows go in characteristic order so
 * concurrent ingests that share a block lock its rows in the same order and queue, not deadlock.
 */
export async function recordDisplayBlocks(trx: Knex.Transaction, runId: number, measurements: ReadonlyArray<{ characteristicId: number; value: number }>): Promise<void> {
  if (measurements.length === 0) return;
  const block = blockOf(runId);
  const sorted = [...measurements].sort((a, b) => a.characteristicId - b.characteristicId);
  await trx.raw(
    `INSERT INTO spc_display_blocks (characteristic_id, block_no, first_run_id, last_run_id, n, sum, sum_sq, min_value, max_value)
     VALUES ${sorted.map(() => '(?,?,?,?,1,?,?,?,?)').join(',')}
     ON DUPLICATE KEY UPDATE first_run_id = LEAST(first_run_id, VALUES(first_run_id)), last_run_id = GREATEST(last_run_id, VALUES(last_run_id)),
       n = n + VALUES(n), sum = sum + VALUES(sum), sum_sq = sum_sq + VALUES(sum_sq),
       min_value = LEAST(min_value, VALUES(min_value)), max_value = GREATEST(max_value, VALUES(max_value))`,
    sorted.flatMap((m) => [m.characteristicId, block, runId, runId, m.value, m.value * m.value, m.value, m.value]),
  );
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
