import { createRemoteJWKSet, jwtVerify, errors as joseErrors } from 'jose';
import type { Config } from '../config.js';
import type { Oidc } from './oidc.js';
import { AppError } from '../errors.js';

export type ClientPrincipal = { kind: 'client'; clientId: string; scopes: string[] };

/** Verified tokens kept until they expire: a station posts many runs with one token. */
const maxRememberedTokens = 1000;

/** Verifies OAuth2 access tokens (JWT, typ at+jwt) from the IdP: signature, issuer, audience, expiry. */
export function createBearerVerifier(config: Config, oidc: Oidc) {
  let jwks: ReturnType<typeof createRemoteJWKSet> | null = null;
  // The same bytes verify the same way, so a token checked once needs only its expiry checked again.
  const verified = new Map<string, { principal: ClientPrincipal; expiresAtMs: number }>();

  return async function verifyBearer(token: string): Promise<ClientPrincipal> {
    const known = verified.get(token);
    if (known && known.expiresAtMs > Date.now()) return known.principal;
    verified.delete(token);
    jwks ??= createRemoteJWKSet(new URL(await oidc.jwksUri()));
    try {
      const { payload } = await jwtVerify(token, jwks, {
        issuer: config.oidc.issuer,
        audience: config.oidc.apiAudience,
        typ: 'at+jwt',
        clockTolerance: 0,
      });
      const clientId = typeof payload.client_id === 'string' ? payload.client_id : payload.sub;
      if (!clientId) throw new AppError(401, 'invalid_token', 'The access token names no client.');
      const scopes = typeof payload.scope === 'string' ? payload.scope.split(' ').filter(Boolean) : [];
      const principal: ClientPrincipal = { kind: 'client', clientId, scopes };
      if (typeof payload.exp === 'number') {
        if (verified.size >= maxRememberedTokens) verified.delete(verified.keys().next().value as string);
        verified.set(token, { principal, expiresAtMs: payload.exp * 1000 });
      }
      return principal;
    } catch (error) {
      if (error instanceof AppError) throw error;
      if (error instanceof joseErrors.JWTExpired) throw new AppError(401, 'token_expired', 'The access token has expired.');
      if (error instanceof joseErrors.JWTClaimValidationFailed) {
        throw new AppError(401, 'invalid_token', `The access token was refused: ${error.claim} claim is wrong.`);
      }
      if (error instanceof joseErrors.JOSEError) throw new AppError(401, 'invalid_token', 'The access token could not be verified.');
      throw error;
    }
  };
}

export type VerifyBearer = ReturnType<typeof createBearerVerifier>;
