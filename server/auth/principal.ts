import type { RequestHandler } from 'express';
import type { SessionUser } from './session.js';
import type { ClientPrincipal, VerifyBearer } from './bearer.js';
import { permissionsOf, type Action } from './permissions.js';
import { AppError, forbidden, unauthenticated } from '../errors.js';

export type UserPrincipal = { kind: 'user'; user: SessionUser; permissions: readonly Action[] };
export type Principal = UserPrincipal | ClientPrincipal;

declare module 'express-serve-static-core' {
  interface Request {
    principal?: Principal;
  }
}

/** Who is calling: a station or integration client (bearer token) or a signed-in person (session). */
export function resolvePrincipal(verifyBearer: VerifyBearer): RequestHandler {
  return async (req, _res, next) => {
    const header = req.get('authorization');
    if (header) {
      const match = /^Bearer\s+(\S+)$/i.exec(header);
      if (!match) throw new AppError(401, 'invalid_token', 'The Authorization header must be "Bearer <token>".');
      req.principal = await verifyBearer(match[1]);
    } else if (req.session?.user) {
      req.principal = { kind: 'user', user: req.session.user, permissions: permissionsOf(req.session.user.role) };
    }
    next();
  };
}

/**
 * The action a route needs. Signed-in people are checked against the permission table;
 * machine clients only pass when they hold one of the listed scopes.
 */
export function requirePermission(action: Action, options: { scopes?: readonly string[] } = {}): RequestHandler {
  return (req, _res, next) => {
    const principal = req.principal;
    if (!principal) throw unauthenticated();
    if (principal.kind === 'user') {
      if (!principal.permissions.includes(action)) throw forbidden(`Your role (${principal.user.role}) may not ${action.replace(':', ' ')}.`);
      return next();
    }
    if (!options.scopes?.some((scope) => principal.scopes.includes(scope))) {
      throw new AppError(403, 'insufficient_scope', `This endpoint needs one of the scopes: ${(options.scopes ?? []).join(', ') || '(none: people only)'}.`);
    }
    next();
  };
}

/** Machine-only routes (a station posting its runs). */
export function requireScope(scope: string): RequestHandler {
  return (req, _res, next) => {
    const principal = req.principal;
    if (!principal) throw unauthenticated('A bearer access token is required.');
    if (principal.kind !== 'client') throw forbidden('Only station clients may call this endpoint.');
    if (!principal.scopes.includes(scope)) throw new AppError(403, 'insufficient_scope', `This endpoint needs the scope ${scope}.`);
    next();
  };
}

export function currentUser(principal: Principal | undefined): SessionUser {
  if (principal?.kind !== 'user') throw unauthenticated();
  return principal.user;
}
