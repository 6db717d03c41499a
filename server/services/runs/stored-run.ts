import { jsonColumn } from '../../db/json-column.js';
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { conflict } from '../../errors.js';
import { plainDataCanonicalJson } from '../audit/hash.js';
import type { TestRunDocument, TestRunResponse } from '../../schemas/test-run.js';

export type IngestOutcome = { status: 201 | 200; body: TestRunResponse };

/** SHA-256 of the document with its keys sorted, so key order and whitespace do not count. */
export function bodySha256(document: TestRunDocument): string {
  return createHash('sha256').update(plainDataCanonicalJson(document)).digest('hex');
}

/**
 * Stands retry on timeouts: the same runId with the same body gets the first answer again (200);
 * the same runId with another body is a different run under a reused id (409). Null when new.
 */
export async function answerForRetry(db: Knex, runId: string, sha256: string): Promise<IngestOutcome | null> {
  const stored = await db('test_runs').where({ run_uuid: runId }).first('body_sha256', 'response_json');
  if (!stored) return null;
  if (stored.body_sha256 !== sha256) {
    throw conflict(`Run ${runId} was already received with a different body; a new run needs a new runId.`, [{ field: 'runId', message: 'already used for a different run' }]);
  }
  return { status: 200, body: jsonColumn<TestRunResponse>(stored.response_json) };
}
