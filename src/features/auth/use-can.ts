import type { Action } from '../../lib/permissions';
import { useMe } from './api/get-me';

/** True when the signed-in user's permissions (as sent by GET /api/me) include `action`. */
export function useCan(action: Action): boolean {
  const { data } = useMe();
  return data?.permissions.includes(action) ?? false;
}
