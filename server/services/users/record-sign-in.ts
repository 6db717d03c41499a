import type { Knex } from 'knex';
import { recordAudit } from '../audit/record-audit.js';
import type { Role } from '../../auth/permissions.js';

export type SignInClaims = { subject: string; name: string; email: string; role: Role };

/**
 * Creates or refreshes the user row from the IdP's claims. The role comes from the IdP; a new
 * user or a changed role is written to the audit trail.
 */
export async function recordSignIn(db: Knex, claims: SignInClaims, now = new Date()) {
  return db.transaction(async (trx) => {
    const existing = await trx('users').where({ subject: claims.subject }).forUpdate().first();
    if (!existing) {
      const [id] = await trx('users').insert({
        subject: claims.subject, name: claims.name, email: claims.email, role: claims.role,
        first_seen_at: now, last_seen_at: now,
      });
      await recordAudit(trx, {
        actor: { name: claims.name, role: claims.role }, action: 'user.first-sign-in', entityType: 'user',
        entityId: claims.subject, after: { name: claims.name, email: claims.email, role: claims.role },
        reason: 'role from the identity provider', at: now,
      });
      return { id: Number(id), ...claims };
    }
    await trx('users').where({ id: existing.id }).update({ name: claims.name, email: claims.email, role: claims.role, last_seen_at: now });
    if (existing.role !== claims.role) {
      await recordAudit(trx, {
        actor: { name: 'identity provider', role: null }, action: 'user.role-changed', entityType: 'user',
        entityId: claims.subject, before: { role: existing.role }, after: { role: claims.role },
        reason: 'role claim changed at sign-in', at: now,
      });
    }
    return { id: Number(existing.id), ...claims };
  });
}
