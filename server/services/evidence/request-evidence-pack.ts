import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { checkFilterReferences, normaliseFilter, type PackFilter } from './pack-filter.js';

/** Queues a pack; a background job builds it. The filter is checked now so a typo fails at once. */
export async function requestEvidencePack(db: Knex, user: SessionUser, filter: PackFilter): Promise<{ id: number }> {
  const clean = normaliseFilter(filter);
  await checkFilterReferences(db, clean);
  const [id] = await db('export_jobs').insert({
    requested_by: user.subject,
    requested_by_name: user.name,
    requested_by_role: user.role,
    filter_json: JSON.stringify(clean),
    status: 'queued',
    created_at: db.fn.now(3),
  });
  return { id: Number(id) };
}
