import { createWriteStream, type WriteStream } from 'node:fs';
import { once } from 'node:events';
import { finished } from 'node:stream/promises';
import type { Knex } from 'knex';
import type { PackFilter } from './pack-filter.js';
import { eachRunPage } from './read-pack-runs.js';
import { csvLine } from './safe-text.js';

export const csvHeader = ['serial', 'run_id', 'attempt', 'characteristic', 'value', 'unit', 'lsl', 'usl', 'verdict', 'station', 'operator_badge', 'started_at_utc'];

async function put(out: WriteStream, text: string): Promise<void> {
  if (!out.write(text)) await once(out, 'drain');
}

/** The long-format CSV: one line per measurement, UTF-8, written page by page. Returns the line count. */
export async function writePackCsv(
  db: Knex,
  filter: PackFilter,
  path: string,
  onPage: (rowsWritten: number) => Promise<void>,
): Promise<number> {
  const out = createWriteStream(path, { encoding: 'utf8' });
  let rows = 0;
  try {
    await put(out, csvLine(csvHeader));
    await eachRunPage(db, filter, {}, async (runs) => {
      let chunk = '';
      let inPage = 0;
      for (const run of runs) {
        for (const m of run.measurements) {
          chunk += csvLine([run.serial, run.uuid, run.attempt, m.code, m.value, m.unit, m.lsl, m.usl, m.verdict, run.station, run.operatorBadge, run.startedAt.toISOString()]);
          inPage += 1;
        }
      }
      await put(out, chunk);
      rows += inPage;
      await onPage(inPage);
    });
  } finally {
    out.end();
    await finished(out);
  }
  return rows;
}
