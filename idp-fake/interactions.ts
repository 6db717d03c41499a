import express from 'express';
import type { NextFunction, Request, Response } from 'express';
import type Provider from 'oidc-provider';
import type { InteractionDetails } from 'oidc-provider';
import { checkCredentials } from './accounts.js';
import { contentSecurityPolicy, errorPage, newNonce, signInPage } from './pages.js';

function sendPage(res: Response, status: number, html: (nonce: string) => string): void {
  const nonce = newNonce();
  res
    .status(status)
    .set({
      'Content-Security-Policy': contentSecurityPolicy(nonce),
      'Cache-Control': 'no-store',
      'Content-Type': 'text/html; charset=utf-8',
    })
    .send(html(nonce));
}

/** Every client here is first-party, so a consent prompt is answered by granting what is missing. */
async function grantMissing(provider: Provider, details: InteractionDetails): Promise<string> {
  const accountId = details.session?.accountId;
  const clientId = details.params.client_id;
  if (!accountId || typeof clientId !== 'string') throw new Error('consent prompt without a signed-in account');
  const grant = details.grantId
    ? await provider.Grant.find(details.grantId)
    : new provider.Grant({ accountId, clientId });
  if (!grant) throw new Error(`grant ${details.grantId} not found`);
  const { missingOIDCScope, missingOIDCClaims, missingResourceScopes } = details.prompt.details;
  if (missingOIDCScope) grant.addOIDCScope(missingOIDCScope.join(' '));
  if (missingOIDCClaims) grant.addOIDCClaims(missingOIDCClaims);
  for (const [resource, scopes] of Object.entries(missingResourceScopes ?? {})) {
    grant.addResourceScope(resource, scopes.join(' '));
  }
  return grant.save();
}

/** Our own sign-in routes in front of oidc-provider (its development interactions are off). */
export function interactionRoutes(provider: Provider): express.Router {
  const router = express.Router();

  router.get('/interaction/:uid', async (req: Request, res: Response) => {
    const details = await provider.interactionDetails(req, res);
    if (details.prompt.name === 'login') {
      sendPage(res, 200, (nonce) => signInPage({ uid: details.uid, nonce }));
      return;
    }
    const grantId = await grantMissing(provider, details);
    await provider.interactionFinished(req, res, { consent: { grantId } }, { mergeWithLastSubmission: true });
  });

  router.post('/interaction/:uid/login', express.urlencoded({ extended: false }), async (req: Request, res: Response) => {
    const details = await provider.interactionDetails(req, res);
    const body = (req.body ?? {}) as Record<string, unknown>;
    const login = typeof body.login === 'string' ? body.login : '';
    const password = typeof body.password === 'string' ? body.password : '';
    const accountId = checkCredentials(login, password);
    if (!accountId) {
      sendPage(res, 401, (nonce) => signInPage({ uid: details.uid, nonce, login, failed: true }));
      return;
    }
    await provider.interactionFinished(req, res, { login: { accountId } }, { mergeWithLastSubmission: false });
  });

  // An expired or unknown interaction ends here rather than in Express's plain-text default.
  router.use((error: Error, _req: Request, res: Response, _next: NextFunction) => {
    sendPage(res, 400, (nonce) => errorPage('Sign-in expired', error.message || 'The sign-in request is no longer valid.', nonce));
  });

  return router;
}
