import { errors } from 'oidc-provider';
import type { Client, Configuration, Grant, KoaContextWithOIDC, ResourceServer } from 'oidc-provider';
import { findAccount } from './accounts.js';
import { buildClients, SHORT_LIVED_CLIENT_ID, WEB_CLIENT_ID } from './clients.js';
import { contentSecurityPolicy, errorPage, newNonce, signedOutPage, signOutPage } from './pages.js';

/** A second resource the IdP knows, so tests can obtain a token meant for another audience. */
export const OTHER_AUDIENCE = 'urn:other:api';
const RESOURCE_SCOPES = ['test-runs:write', 'records:read'];
const WEB_SCOPE = 'openid profile email roles';

export interface ConfigurationInput {
  appBaseUrls: string[];
  apiAudience: string;
  signingJwk: object;
  cookieKeys: string[];
}

function renderPage(ctx: KoaContextWithOIDC, html: (nonce: string) => string): void {
  const nonce = newNonce();
  ctx.set('Content-Security-Policy', contentSecurityPolicy(nonce));
  ctx.type = 'html';
  ctx.body = html(nonce);
}

/** Skips the consent screen for the first-party web app by granting its fixed scopes up front. */
async function loadExistingGrant(ctx: KoaContextWithOIDC): Promise<Grant | undefined> {
  const { client, account, session, provider } = ctx.oidc;
  if (!client || !account) return undefined;
  const grantId = ctx.oidc.result?.consent?.grantId ?? session.grantIdFor(client.clientId);
  const existing = grantId ? await provider.Grant.find(grantId) : undefined;
  if (existing && existing.accountId === account.accountId) return existing;
  if (client.clientId !== WEB_CLIENT_ID) return undefined;

  const grant = new provider.Grant({ accountId: account.accountId, clientId: client.clientId });
  grant.addOIDCScope(WEB_SCOPE);
  await grant.save();
  return grant;
}

export function buildConfiguration(input: ConfigurationInput): Configuration {
  const knownAudiences = new Set([input.apiAudience, OTHER_AUDIENCE]);

  async function getResourceServerInfo(
    _ctx: KoaContextWithOIDC,
    resource: string,
    client: Client,
  ): Promise<ResourceServer> {
    if (!knownAudiences.has(resource)) throw new errors.InvalidTarget();
    // A client never receives more than its registered scope, whatever it asks for.
    const allowed = new Set(client.scope?.split(' ') ?? []);
    return {
      scope: RESOURCE_SCOPES.filter((scope) => allowed.has(scope)).join(' '),
      audience: resource,
      accessTokenFormat: 'jwt',
      jwt: { sign: { alg: 'RS256' } },
    };
  }

  // Machine clients get JWTs for the API by default; the web app keeps an opaque token for userinfo.
  async function defaultResource(_ctx: KoaContextWithOIDC, client: Client, oneOf?: string[]) {
    if (oneOf) return oneOf;
    return client.grantTypes.includes('client_credentials') ? input.apiAudience : undefined;
  }

  return {
    clients: buildClients(input.appBaseUrls),
    jwks: { keys: [input.signingJwk] },
    cookies: { keys: input.cookieKeys },
    findAccount,
    loadExistingGrant,
    claims: { openid: ['sub'], profile: ['name'], email: ['email'], roles: ['roles'] },
    scopes: ['openid', 'offline_access', 'profile', 'email', 'roles', ...RESOURCE_SCOPES],
    conformIdTokenClaims: false,
    responseTypes: ['code'],
    pkce: { required: () => true },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    renderError: async (ctx, out) => {
      renderPage(ctx, (nonce) => errorPage('Sign-in problem', out.error_description ?? out.error ?? 'Unknown error', nonce));
    },
    ttl: {
      AccessToken: 3600,
      AuthorizationCode: 60,
      IdToken: 3600,
      Interaction: 3600,
      Session: 8 * 3600,
      Grant: 8 * 3600,
      RefreshToken: 8 * 3600,
      ClientCredentials: (_ctx, _token, client) => (client.clientId === SHORT_LIVED_CLIENT_ID ? 1 : 3600),
    },
    features: {
      devInteractions: { enabled: false },
      clientCredentials: { enabled: true },
      introspection: { enabled: true },
      revocation: { enabled: true },
      rpInitiatedLogout: {
        enabled: true,
        logoutSource: async (ctx: KoaContextWithOIDC, form: string) => {
          renderPage(ctx, (nonce) => signOutPage(form, nonce));
        },
        postLogoutSuccessSource: async (ctx: KoaContextWithOIDC) => {
          renderPage(ctx, (nonce) => signedOutPage(nonce));
        },
      },
      resourceIndicators: {
        enabled: true,
        defaultResource,
        useGrantedResource: () => true,
        getResourceServerInfo,
      },
    },
  };
}
