import type { Action, Role } from '../../server/auth/permissions';

export type { Action, Role };

/** Typed as Record<Role, …> so the compiler flags any role the server adds and the client lacks. */
export const roleLabels: Record<Role, string> = {
  operator: 'Operator',
  quality: 'Quality',
  auditor: 'Auditor',
  manager: 'Manager',
  admin: 'Admin',
};

export const roles = Object.keys(roleLabels) as [Role, ...Role[]];
