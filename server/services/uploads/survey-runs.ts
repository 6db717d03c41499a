import { runsOf } from './assemble-runs.js';
import { openUpload, type UploadFile } from './open-upload-file.js';

/** What a first read of the whole file tells before any run is checked or stored. */
export type Survey = { rowsTotal: number; runsTotal: number; repeats: ReadonlyMap<string, readonly number[]> };

/**
 * Reads the whole file once: its structure (a broken file is refused before anything is stored),
 * its data rows (for progress) and the runs it gives in more than one place. Such a run is
 * ambiguous (which place holds its values?), so every place is refused; storing the first and
 * reporting the rest would leave a partial run that a corrected file could never complete.
 */
export async function surveyRuns(file: UploadFile): Promise<Survey> {
  const { layout, rows } = await openUpload(file);
  const firstRow = new Map<string, number>();
  const repeats = new Map<string, number[]>();
  let rowsTotal = 0;
  let runsTotal = 0;
  for await (const run of runsOf(rows, layout, file.options)) {
    rowsTotal += run.rowCount;
    runsTotal++;
    const first = firstRow.get(run.runId);
    if (first === undefined) firstRow.set(run.runId, run.firstRow);
    else repeats.set(run.runId, [...(repeats.get(run.runId) ?? [first]), run.firstRow]);
  }
  return { rowsTotal, runsTotal, repeats };
}
