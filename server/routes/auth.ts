import { Router } from 'express';
import * as client from 'openid-client';
import rateLimit from 'express-rate-limit';
import type { Knex } from 'knex';
import type { Config } from '../config.js';
import type { Oidc } from '../auth/oidc.js';
import { isRole } from '../auth/permissions.js';
import { recordSignIn } from '../services/users/record-sign-in.js';
import { AppError } from '../errors.js';

/** Only same-site paths may be returned to after sign-in (no open redirect). */
function safeReturnTo(value: unknown): string {
  return typeof value === 'string' && value.startsWith('/') && !value.startsWith('//') ? value : '/';
}

function regenerate(req: Express.Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

export function authRouter(config: Config, db: Knex, oidc: Oidc) {
  const router = Router();
  const redirectUri = `${config.publicUrl}/auth/callback`;
  router.use(rateLimit({ windowMs: 60_000, limit: config.loginRateLimit, standardHeaders: 'draft-8', legacyHeaders: false }));

  router.get('/login', async (req, res) => {
    const oidcConfig = await oidc.configuration();
    const codeVerifier = client.randomPKCECodeVerifier();
    const state = client.randomState();
    const nonce = client.randomNonce();
    req.session.login = { state, nonce, codeVerifier, returnTo: safeReturnTo(req.query.returnTo) };
    const url = client.buildAuthorizationUrl(oidcConfig, {
      redirect_uri: redirectUri,
      scope: 'openid profile email roles',
      code_challenge: await client.calculatePKCECodeChallenge(codeVerifier),
      code_challenge_method: 'S256',
      state,
      nonce,
    });
    req.session.save(() => res.redirect(url.href));
  });

  router.get('/callback', async (req, res) => {
    const pending = req.session.login;
    if (!pending) throw new AppError(400, 'login_expired', 'The sign-in attempt expired; start again from the sign-in page.');
    const oidcConfig = await oidc.configuration();
    const currentUrl = new URL(req.originalUrl, config.publicUrl);
    const tokens = await client.authorizationCodeGrant(oidcConfig, currentUrl, {
      pkceCodeVerifier: pending.codeVerifier, expectedState: pending.state, expectedNonce: pending.nonce,
    });
    const claims = tokens.claims();
    const role = Array.isArray(claims?.roles) ? claims.roles.find(isRole) : undefined;
    if (!claims || !role) throw new AppError(403, 'no_role', 'Your account has no Fluxtrail role; ask an administrator.');
    const user = await recordSignIn(db, {
      subject: claims.sub, name: String(claims.name ?? claims.sub), email: String(claims.email ?? ''), role,
    });
    await regenerate(req); // a new session id on sign-in defeats session fixation
    req.session.user = user;
    req.session.idToken = tokens.id_token;
    req.session.save(() => res.redirect(pending.returnTo));
  });

  router.get('/logout', async (req, res) => {
    const idToken = req.session.idToken;
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('fluxtrail.sid');
    const oidcConfig = await oidc.configuration();
    const url = client.buildEndSessionUrl(oidcConfig, {
      post_logout_redirect_uri: `${config.publicUrl}/signed-out`,
      ...(idToken ? { id_token_hint: idToken } : {}),
    });
    res.redirect(url.href);
  });

  return router;
}
