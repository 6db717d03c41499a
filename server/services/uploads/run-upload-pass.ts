import type { Knex } from 'knex';
import { runsOf, type CandidateRun } from './assemble-runs.js';
import { documentOf } from './locate-field.js';
import { checkRuns, storeRuns, type PreparedRun, type RunOutcome } from './judge-runs.js';
import { openUpload, type UploadFile } from './open-upload-file.js';
import { surveyRuns } from './survey-runs.js';

/** Runs per chunk: each chunk's outcomes and the upload's progress are written before the next. */
const CHUNK_RUNS = 100;

/** Thrown between chunks when the process is shutting down; the upload is handed back, not failed. */
export class PassStopped extends Error {
  constructor() { super('upload pass stopped for a shutdown'); }
}

/**
 * One pass over an uploaded file: `check` (the dry run) or `commit`. The file is read as a stream,
 * run by run, in chunks; after each chunk its outcomes, problems and the progress are written to
 * the upload, so a poller sees a large file advance and a crashed pass can be taken up again.
 * When `stop` is aborted the pass ends after the chunk it is in (PassStopped).
 */
export async function runUploadPass(db: Knex, uploadId: number, file: UploadFile, mode: 'check' | 'commit', stop?: AbortSignal): Promise<void> {
  // A commit taken up again keeps the runs an earlier attempt stored; everything else is redone.
  const stale = db('upload_runs').where({ upload_id: uploadId });
  await (mode === 'commit' ? stale.whereNot({ outcome: 'stored' }) : stale).delete();
  await db('upload_problems').where({ upload_id: uploadId }).delete();
  const { rowsTotal, repeats } = await surveyRuns(file);
  const { layout, rows } = await openUpload(file);
  let chunk: PreparedRun[] = [];
  let rowsDone = 0;
  const flush = async () => {
    const outcomes = await (mode === 'check' ? checkRuns : storeRuns)(db, chunk, new Date());
    await writeOutcomes(db, uploadId, outcomes);
    rowsDone += chunk.reduce((sum, p) => sum + p.run.rowCount, 0);
    await db('uploads').where({ id: uploadId }).update({ progress: rowsTotal === 0 ? 1 : Math.min(1, rowsDone / rowsTotal), heartbeat_at: new Date() });
    chunk = [];
    if (stop?.aborted) throw new PassStopped();
  };
  for await (const run of runsOf(rows, layout, file.options)) {
    chunk.push(prepare(run, repeats.get(run.runId)));
    if (chunk.length >= CHUNK_RUNS) await flush();
  }
  if (chunk.length > 0) await flush();
}

/** A run's document, unless the file's own checks (numbers, columns, schema, repeats) failed. */
function prepare(run: CandidateRun, places: readonly number[] | undefined): PreparedRun {
  const problems = [...run.problems];
  if (places) {
    const together = run.layout.results ? '' : ', its rows one after the other';
    problems.push({ row: run.firstRow, column: '(run)', message: `the run of serial ${run.fields.serial} on ${run.fields.station} started ${run.fields.startedAt} is given in more than one place (rows ${places.join(', ')}); a run must appear once${together}, so none of these is stored` });
  }
  if (problems.length > 0) return { run, document: null, problems };
  const read = documentOf(run);
  return 'document' in read ? { run, document: read.document, problems: [] } : { run, document: null, problems: read.problems };
}

async function writeOutcomes(db: Knex, uploadId: number, outcomes: RunOutcome[]): Promise<void> {
  if (outcomes.length === 0) return;
  const runs = outcomes.map(({ prepared: { run }, outcome, verdict }) => ({
    upload_id: uploadId,
    // Only valid runs carry their runId: an invalid one may share it with another place in the file.
    run_uuid: outcome === 'invalid' ? null : run.runId,
    serial: run.fields.serial.slice(0, 64) || null, station: run.fields.station.slice(0, 64) || null, started_at: run.fields.startedAt.slice(0, 40) || null,
    first_row: run.firstRow, last_row: run.lastRow, row_count: run.rowCount, outcome, verdict,
  }));
  // A run stored by an earlier, interrupted commit keeps its row (and its outcome 'stored').
  await db('upload_runs').insert(runs).onConflict(['upload_id', 'run_uuid']).ignore();
  const problems = outcomes.flatMap((o) => o.problems.map((p) => ({ upload_id: uploadId, row_number: p.row, column_name: p.column.slice(0, 255), message: p.message })));
  if (problems.length > 0) await db('upload_problems').insert(problems);
}
