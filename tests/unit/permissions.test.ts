import { describe, expect, it } from 'vitest';
import { actions, can, permissionsOf, roles, type Action, type Role } from '../../server/auth/permissions.js';

// The permission table as a table: which role may do what (DESIGN.md "Who uses it").
const expected: Array<[Role, Action, boolean]> = [
  ['operator', 'scan:use', true],
  ['operator', 'rework:record', true],
  ['operator', 'holds:release', false],
  ['operator', 'limits:approve', false],
  ['operator', 'evidence:create', false],
  ['quality', 'limits:author', true],
  ['quality', 'limits:approve', true],
  ['quality', 'signals:act', true],
  ['quality', 'spc:manage', true],
  ['quality', 'stations:manage', false],
  ['quality', 'audit:verify', false],
  ['auditor', 'evidence:create', true],
  ['auditor', 'audit:verify', true],
  ['auditor', 'holds:place', false],
  ['auditor', 'limits:author', false],
  ['auditor', 'scan:use', false],
  ['manager', 'yield:read', true],
  ['manager', 'signals:act', false],
  ['manager', 'evidence:read', false],
  ['admin', 'stations:manage', true],
  ['admin', 'users:manage', true],
  ['admin', 'limits:approve', false],
  ['admin', 'signals:act', false],
];

describe('permission table', () => {
  it.each(expected)('when the role is %s and the action %s, then allowed is %s', (role, action, allowed) => {
    expect(can(role, action)).toBe(allowed);
  });

  it('when nobody is signed in, then nothing is allowed', () => {
    expect(actions.some((action) => can(undefined, action))).toBe(false);
  });

  it('when listing a role\'s permissions, then every entry is a known action and none repeats', () => {
    for (const role of roles) {
      const list = permissionsOf(role);
      expect(new Set(list).size).toBe(list.length);
      for (const action of list) expect(actions).toContain(action);
    }
  });

  it('when any role exists, then it may read motor records (the shared record)', () => {
    for (const role of roles) expect(can(role, 'motors:read')).toBe(true);
  });
});
