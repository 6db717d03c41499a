import { jsonColumn } from '../../db/json-column.js';
import type { Knex } from 'knex';
import { AppError } from '../../errors.js';
import type { TestRunDocument, TestRunResponse, Verdict } from '../../schemas/test-run.js';
import { ingestTestRun } from '../runs/ingest-test-run.js';
import { bodySha256 } from '../runs/stored-run.js';
import type { CandidateRun } from './assemble-runs.js';
import { locate } from './locate-field.js';
import type { Problem } from './upload-columns.js';

/** A run read from the file, with its document when the file's own checks passed. */
export type PreparedRun = { run: CandidateRun; document: TestRunDocument | null; problems: Problem[] };
export type RunOutcome = { prepared: PreparedRun; outcome: 'new' | 'stored' | 'duplicate' | 'invalid'; verdict: Verdict | null; problems: Problem[] };

const storedElsewhere = 'this run (serial, startedAt, station) is stored already with other values; a correction is a new run, not an overwrite';

/** Ingest's refusal of one run, as problems on the rows and columns the run came from. */
function refusal(run: CandidateRun, error: unknown): Problem[] {
  if (!(error instanceof AppError) || error.status >= 500) throw error;
  if (error.code === 'conflict') return [{ row: run.firstRow, column: '(run)', message: storedElsewhere }];
  if (error.fields?.length) return error.fields.map((f) => locate(run, f));
  return [{ row: run.firstRow, column: '(run)', message: error.message }];
}

const invalid = (prepared: PreparedRun, problems: Problem[]): RunOutcome => ({ prepared, outcome: 'invalid', verdict: null, problems });

/**
 * The dry run of a chunk: runs already stored are told apart (same values: a duplicate that will
 * be skipped; other values: refused), and every other run goes through the real ingest service
 * inside one transaction that is always rolled back, so the report carries ingest's own checks
 * and verdicts and nothing is kept.
 */
export async function checkRuns(db: Knex, chunk: PreparedRun[], now: Date): Promise<RunOutcome[]> {
  const ids = chunk.flatMap((p) => (p.document ? [p.document.runId] : []));
  const stored = ids.length === 0 ? [] : await db('test_runs').whereIn('run_uuid', ids).select('run_uuid', 'body_sha256', 'response_json');
  const byId = new Map(stored.map((s) => [s.run_uuid as string, s]));
  const trx = await db.transaction();
  try {
    const outcomes: RunOutcome[] = [];
    for (const prepared of chunk) {
      const { document, run } = prepared;
      if (!document) { outcomes.push(invalid(prepared, prepared.problems)); continue; }
      const existing = byId.get(document.runId);
      if (existing && existing.body_sha256 !== bodySha256(document)) { outcomes.push(invalid(prepared, [{ row: run.firstRow, column: '(run)', message: storedElsewhere }])); continue; }
      if (existing) {
        const answer = jsonColumn<TestRunResponse>(existing.response_json);
        outcomes.push({ prepared, outcome: 'duplicate', verdict: answer.verdict, problems: [] });
        continue;
      }
      try {
        const answer = await ingestTestRun(trx, document, { source: 'upload', now });
        outcomes.push({ prepared, outcome: 'new', verdict: answer.body.verdict, problems: [] });
      } catch (error) {
        outcomes.push(invalid(prepared, refusal(run, error)));
      }
    }
    return outcomes;
  } finally {
    await trx.rollback();
  }
}

/** The commit of a chunk: each valid run through ingest, all-or-nothing per run and idempotent per runId. */
export async function storeRuns(db: Knex, chunk: PreparedRun[], now: Date): Promise<RunOutcome[]> {
  const outcomes: RunOutcome[] = [];
  for (const prepared of chunk) {
    if (!prepared.document) { outcomes.push(invalid(prepared, prepared.problems)); continue; }
    try {
      const answer = await ingestTestRun(db, prepared.document, { source: 'upload', now });
      outcomes.push({ prepared, outcome: answer.status === 201 ? 'stored' : 'duplicate', verdict: answer.body.verdict, problems: [] });
    } catch (error) {
      outcomes.push(invalid(prepared, refusal(prepared.run, error)));
    }
  }
  return outcomes;
}
