import type { Knex } from 'knex';
import { notFound } from '../../errors.js';
import type { UploadOptions } from './upload-options.js';

export type UploadRow = {
  id: number; file_name: string; file_sha256: string; file_type: 'csv' | 'xlsx'; format: 'long' | 'wide'; options_json: string;
  uploaded_by: string; uploaded_by_name: string; status: 'checking' | 'dry-run' | 'committing' | 'committed' | 'failed';
  rows_total: number; rows_ok: number; rows_failed: number; runs_new: number; runs_stored: number; runs_duplicate: number; runs_invalid: number;
  progress: number; error: string | null; created_at: Date; checked_at: Date | null; committed_by_name: string | null; committed_by_role: string | null;
  committed_at: Date | null; heartbeat_at: Date | null;
};

/** How an upload is shown: its state and counts; the report (problems, runs) is added by getUpload. */
export function summaryOf(row: UploadRow) {
  const options = JSON.parse(row.options_json) as UploadOptions;
  return {
    id: row.id, fileName: row.file_name, fileSha256: row.file_sha256, fileType: row.file_type,
    format: row.format, delimiter: options.delimiter, decimal: options.decimal,
    status: row.status, progress: row.progress, error: row.error,
    rows: { total: row.rows_total, ok: row.rows_ok, failed: row.rows_failed },
    runs: { new: row.runs_new, stored: row.runs_stored, duplicate: row.runs_duplicate, invalid: row.runs_invalid },
    uploadedBy: row.uploaded_by_name, createdAt: row.created_at.toISOString(), checkedAt: row.checked_at?.toISOString() ?? null,
    committedBy: row.committed_by_name, committedAt: row.committed_at?.toISOString() ?? null,
  };
}

export async function uploadRow(db: Knex, id: number): Promise<UploadRow> {
  const row = (await db('uploads').where({ id }).first()) as UploadRow | undefined;
  if (!row) throw notFound(`Upload ${id} does not exist.`);
  return row;
}

/** One upload with the first problems and runs of its report, in file order. */
export async function getUpload(db: Knex, id: number, limits: { problems: number; runs: number } = { problems: 200, runs: 200 }) {
  const row = await uploadRow(db, id);
  const [problems, runs, [{ problemsTotal }]] = await Promise.all([
    db('upload_problems').where({ upload_id: id }).orderBy([{ column: 'row_number' }, { column: 'id' }]).limit(limits.problems)
      .select('row_number as row', 'column_name as column', 'message'),
    db('upload_runs').where({ upload_id: id }).orderBy('first_row').limit(limits.runs)
      .select('first_row as firstRow', 'last_row as lastRow', 'serial', 'station', 'started_at as startedAt', 'outcome', 'verdict', 'run_uuid as runId'),
    db('upload_problems').where({ upload_id: id }).count({ problemsTotal: '*' }),
  ]);
  return { ...summaryOf(row), problemsTotal: Number(problemsTotal), problems, runList: runs };
}

/** The latest uploads first. */
export async function listUploads(db: Knex, options: { limit: number }) {
  const rows = (await db('uploads').orderBy('id', 'desc').limit(options.limit)) as UploadRow[];
  return { items: rows.map(summaryOf) };
}
