import { timingSafeEqual } from 'node:crypto';
import type { Account } from 'oidc-provider';

/** Every demo account signs in with this password; the IdP is a local stand-in only. */
export const DEMO_PASSWORD = 'fluxtrail';

export interface DemoAccount {
  login: string;
  name: string;
  email: string;
  role: 'operator' | 'quality' | 'auditor' | 'manager' | 'admin';
}

// Invented people; the login name doubles as the subject so seeds can refer to it.
export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { login: 'operator', name: 'Nadia Brenner', email: 'operator@plant.example', role: 'operator' },
  { login: 'quality', name: 'Piet Lindqvist', email: 'quality@plant.example', role: 'quality' },
  { login: 'quality2', name: 'Ana Sousa', email: 'quality2@plant.example', role: 'quality' },
  { login: 'auditor', name: 'Helen Marsh', email: 'auditor@plant.example', role: 'auditor' },
  { login: 'manager', name: 'Ravi Menon', email: 'manager@plant.example', role: 'manager' },
  { login: 'admin', name: 'Jonas Weber', email: 'admin@plant.example', role: 'admin' },
];

function accountByLogin(login: string): DemoAccount | undefined {
  return DEMO_ACCOUNTS.find((account) => account.login === login);
}

function sameText(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

/** Returns the account id when login and password match a demo account, otherwise undefined. */
export function checkCredentials(login: string, password: string): string | undefined {
  const account = accountByLogin(login.trim());
  if (!account || !sameText(password, DEMO_PASSWORD)) return undefined;
  return account.login;
}

/** oidc-provider's findAccount: claims are filtered by the configured scopes afterwards. */
export async function findAccount(_ctx: unknown, id: string): Promise<Account | undefined> {
  const account = accountByLogin(id);
  if (!account) return undefined;
  return {
    accountId: account.login,
    claims: () => ({
      sub: account.login,
      name: account.name,
      email: account.email,
      roles: [account.role],
    }),
  };
}
