/**
 * The one permission table: role → actions. Every route declares the action it needs;
 * the client receives the caller's actions from GET /api/me and never re-derives role logic.
 */
export const roles = ['operator', 'quality', 'auditor', 'manager', 'admin'] as const;
export type Role = (typeof roles)[number];

export const actions = [
  'scan:use',
  'motors:read',
  'lots:read',
  'rework:record',
  'retest:request',
  'holds:place',
  'holds:release',
  'spc:read',
  'spc:manage',
  'signals:read',
  'signals:act',
  'evidence:read',
  'evidence:create',
  'audit:read',
  'audit:verify',
  'yield:read',
  'setup:read',
  'products:manage',
  'limits:author',
  'limits:approve',
  'stations:manage',
  'users:manage',
  'uploads:commit',
] as const;
export type Action = (typeof actions)[number];

const permissionTable: Record<Role, readonly Action[]> = {
  operator: ['scan:use', 'motors:read', 'lots:read', 'rework:record', 'retest:request'],
  quality: [
    'scan:use', 'motors:read', 'lots:read', 'rework:record', 'retest:request',
    'holds:place', 'holds:release', 'spc:read', 'spc:manage', 'signals:read', 'signals:act',
    'evidence:read', 'evidence:create', 'setup:read', 'products:manage', 'limits:author',
    'limits:approve', 'uploads:commit', 'yield:read',
  ],
  auditor: ['motors:read', 'lots:read', 'evidence:read', 'evidence:create', 'audit:read', 'audit:verify'],
  manager: ['motors:read', 'lots:read', 'yield:read', 'signals:read', 'spc:read'],
  admin: [
    'motors:read', 'lots:read', 'setup:read', 'stations:manage', 'users:manage', 'uploads:commit',
    'audit:read', 'audit:verify', 'evidence:read', 'evidence:create',
  ],
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}

export function permissionsOf(role: Role): readonly Action[] {
  return permissionTable[role];
}

export function can(role: Role | undefined, action: Action): boolean {
  return role !== undefined && permissionTable[role].includes(action);
}

/** Machine clients are authorised by OAuth2 scope instead of role. */
export const scopeActions: Record<string, readonly Action[]> = {
  'test-runs:write': [],
  'records:read': ['motors:read', 'lots:read', 'yield:read'],
};
