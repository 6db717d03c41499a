import { fieldPath, type FieldError } from '../../errors.js';
import { testRunDocumentSchema, type TestRunDocument } from '../../schemas/test-run.js';
import type { CandidateRun } from './assemble-runs.js';
import { columnName, runFields, type Problem, type RunField } from './upload-columns.js';

const resultField = /^results\[(\d+)\](?:\.(characteristic|value|unit))?/;

/** A field of the run document (`results[3].value`, `lot`) named as the row and column it came from. */
export function locate(run: CandidateRun, error: FieldError): Problem {
  const result = resultField.exec(error.field);
  if (result) {
    const origin = run.origins[Number(result[1])];
    if (origin) return { row: origin.row, column: origin.columns[(result[2] ?? 'value') as 'value'], message: error.message };
  }
  if ((runFields as readonly string[]).includes(error.field)) {
    return { row: run.firstRow, column: columnName(run.layout, run.layout.run[error.field as RunField]), message: error.message };
  }
  // Faults of the run as a whole (no results at all, a derived value) point at its first row.
  const column = error.field.startsWith('results') ? (run.layout.results ? '(characteristics)' : '(measurements)') : '(run)';
  return { row: run.firstRow, column, message: error.message };
}

/** The run document a candidate becomes, checked by the same schema the station API uses. */
export function documentOf(run: CandidateRun): { document: TestRunDocument } | { problems: Problem[] } {
  const parsed = testRunDocumentSchema.safeParse({ runId: run.runId, ...run.fields, results: run.results });
  if (parsed.success) return { document: parsed.data };
  return { problems: parsed.error.issues.map((issue) => locate(run, { field: fieldPath(issue.path) || '(run)', message: issue.message })) };
}
