import session from 'express-session';
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { Knex } from 'knex';
import type { Role } from './permissions.js';

export type SessionUser = { id: number; subject: string; name: string; email: string; role: Role };

declare module 'express-session' {
  interface SessionData {
    user?: SessionUser;
    idToken?: string;
    login?: { state: string; nonce: string; codeVerifier: string; returnTo: string };
  }
}

export const sessionCookieName = 'fluxtrail.sid';
const eightHoursMs = 8 * 60 * 60 * 1000;

/** Sessions live in MariaDB so several app processes can serve the same user. */
export function sessionMiddleware(db: Knex, secret: string, secureCookie: boolean) {
  const store = new ConnectSessionKnexStore({ knex: db, tableName: 'sessions', createTable: false, cleanupInterval: 0 });
  // The store checks its table at construction; when the database is down that check fails
  // here, and again (handled) on each session look-up, which answers that request with an error.
  store.ready.catch(() => undefined);
  return session({
    name: sessionCookieName,
    secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: secureCookie, maxAge: eightHoursMs },
  });
}
