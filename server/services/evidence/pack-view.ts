import type { PackFilter } from './pack-filter.js';

export type ExportJobRow = {
  id: number; requested_by: string; requested_by_name: string; requested_by_role: string; filter_json: string | PackFilter;
  status: 'queued' | 'running' | 'done' | 'failed' | 'cancelled'; progress: number; rows_done: number; rows_total: number | null;
  file_key: string | null; size_bytes: number | string | null; sha256: string | null; error: string | null;
  cancel_requested: number | boolean; worker: string | null; created_at: Date; heartbeat_at: Date | null;
  started_at: Date | null; finished_at: Date | null;
};

export type EvidencePackView = {
  id: number;
  status: ExportJobRow['status'];
  progress: number;
  rows: number;
  rowsTotal: number | null;
  sha256: string | null;
  sizeBytes: number | null;
  error: string | null;
  cancelRequested: boolean;
  filter: PackFilter;
  requestedBy: { name: string; role: string };
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
};

const iso = (value: Date | null) => (value ? new Date(value).toISOString() : null);

export function parseStoredFilter(value: ExportJobRow['filter_json']): PackFilter {
  return typeof value === 'string' ? (JSON.parse(value) as PackFilter) : value;
}

export function toPackView(row: ExportJobRow): EvidencePackView {
  return {
    id: Number(row.id),
    status: row.status,
    progress: Math.min(1, Math.max(0, Number(row.progress))),
    rows: Number(row.rows_done),
    rowsTotal: row.rows_total === null ? null : Number(row.rows_total),
    sha256: row.sha256,
    sizeBytes: row.size_bytes === null ? null : Number(row.size_bytes),
    error: row.error,
    cancelRequested: Boolean(row.cancel_requested),
    filter: parseStoredFilter(row.filter_json),
    requestedBy: { name: row.requested_by_name, role: row.requested_by_role },
    createdAt: new Date(row.created_at).toISOString(),
    startedAt: iso(row.started_at),
    finishedAt: iso(row.finished_at),
  };
}
