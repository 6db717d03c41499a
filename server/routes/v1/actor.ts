import type { Request } from 'express';
import type { Actor } from '../../services/audit/record-audit.js';
import { unauthenticated } from '../../errors.js';

/** Who the audit trail names for this request: the signed-in person, or the machine client. */
export function actorOf(req: Request): Actor {
  const principal = req.principal;
  if (!principal) throw unauthenticated();
  if (principal.kind === 'user') return { name: principal.user.name, role: principal.user.role };
  return { name: `client ${principal.clientId}`, role: null };
}
