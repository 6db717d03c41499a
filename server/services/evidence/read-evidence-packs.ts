import type { Knex } from 'knex';
import { conflict, notFound } from '../../errors.js';
import { toPackView, type EvidencePackView, type ExportJobRow } from './pack-view.js';
import { join } from 'node:path';

export async function getEvidencePack(db: Knex, id: number): Promise<EvidencePackView> {
  const row = (await db('export_jobs').where({ id }).first()) as ExportJobRow | undefined;
  if (!row) throw notFound(`No evidence pack ${id}.`);
  return toPackView(row);
}

/** Past and running packs, newest first, keyset-paged on id. */
export async function listEvidencePacks(db: Knex, page: { cursor?: number; limit: number }): Promise<{ items: EvidencePackView[]; nextCursor: string | null }> {
  const q = db('export_jobs').orderBy('id', 'desc').limit(page.limit + 1);
  if (page.cursor !== undefined) q.where('id', '<', page.cursor);
  const rows = (await q) as ExportJobRow[];
  const items = rows.slice(0, page.limit).map(toPackView);
  return { items, nextCursor: rows.length > page.limit ? String(items[items.length - 1].id) : null };
}

export type PackFile = { path: string; sizeBytes: number; sha256: string; downloadName: string };

/** The finished zip on disk, exactly the file whose hash the pack shows. */
export async function openEvidencePackFile(db: Knex, dataDir: string, id: number): Promise<PackFile> {
  const row = (await db('export_jobs').where({ id }).first()) as ExportJobRow | undefined;
  if (!row) throw notFound(`No evidence pack ${id}.`);
  if (row.status !== 'done' || !row.file_key || !row.sha256) throw conflict(`Evidence pack ${id} is ${row.status}; only a finished pack can be downloaded.`);
  return { path: join(dataDir, row.file_key), sizeBytes: Number(row.size_bytes), sha256: row.sha256, downloadName: `fluxtrail-evidence-pack-${id}.zip` };
}
