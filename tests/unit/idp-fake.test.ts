import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as client from 'openid-client';
import { createRemoteJWKSet, decodeJwt, jwtVerify } from 'jose';
import { startIdp } from '../../idp-fake/index.js';
import type { RunningIdp } from '../../idp-fake/index.js';

const APP_BASE = 'http://127.0.0.1:39180';
const REDIRECT_URI = `${APP_BASE}/auth/callback`;
const API_AUDIENCE = 'urn:fluxtrail:api';

let idp: RunningIdp;

beforeAll(async () => {
  idp = await startIdp({ port: 0, appBaseUrls: [APP_BASE] });
});
afterAll(async () => {
  await idp.close();
});

async function clientCredentials(clientId: string, params: Record<string, string>): Promise<Response> {
  const basic = Buffer.from(`${clientId}:${clientId}-secret`).toString('base64');
  return fetch(`${idp.issuer}/token`, {
    method: 'POST',
    headers: { authorization: `Basic ${basic}`, 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ grant_type: 'client_credentials', ...params }),
  });
}

async function accessToken(clientId: string, params: Record<string, string>): Promise<string> {
  const response = await clientCredentials(clientId, params);
  const body = (await response.json()) as { access_token?: string; error?: string };
  if (!body.access_token) throw new Error(`no token for ${clientId}: ${JSON.stringify(body)}`);
  return body.access_token;
}

/** A minimal cookie jar, enough for one browser-like walk through the IdP's redirects. */
class CookieJar {
  private readonly cookies = new Map<string, string>();

  store(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const separator = pair.indexOf('=');
      const name = pair.slice(0, separator);
      const value = pair.slice(separator + 1);
      if (value === '' || /expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }
}

async function browse(jar: CookieJar, url: string, init: RequestInit = {}): Promise<Response> {
  const response = await fetch(url, {
    ...init,
    redirect: 'manual',
    headers: { ...(init.headers as Record<string, string>), cookie: jar.header() },
  });
  jar.store(response);
  return response;
}

function locationOf(response: Response, base: string): string {
  const location = response.headers.get('location');
  if (!location) throw new Error(`expected a redirect, got HTTP ${response.status}`);
  return new URL(location, base).href;
}

async function postForm(jar: CookieJar, url: string, fields: Record<string, string>): Promise<Response> {
  return browse(jar, url, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields),
  });
}

async function discoverWebClient(): Promise<client.Configuration> {
  return client.discovery(
    new URL(idp.issuer),
    'fluxtrail-web',
    'fluxtrail-web-secret',
    undefined,
    { execute: [client.allowInsecureRequests] },
  );
}

/** Starts an authorization-code + PKCE request and returns the URL of our sign-in page. */
async function openSignInPage(jar: CookieJar, config: client.Configuration, verifier: string, state: string) {
  const authorizationUrl = client.buildAuthorizationUrl(config, {
    redirect_uri: REDIRECT_URI,
    scope: 'openid profile email roles',
    code_challenge: await client.calculatePKCECodeChallenge(verifier),
    code_challenge_method: 'S256',
    state,
  });
  const started = await browse(jar, authorizationUrl.href);
  return locationOf(started, idp.issuer);
}

async function signIn(jar: CookieJar, config: client.Configuration, login: string) {
  const verifier = client.randomPKCECodeVerifier();
  const state = client.randomState();
  const signInUrl = await openSignInPage(jar, config, verifier, state);
  const posted = await postForm(jar, `${signInUrl}/login`, { login, password: 'fluxtrail' });
  const resumed = await browse(jar, locationOf(posted, idp.issuer));
  const callbackUrl = new URL(locationOf(resumed, idp.issuer));
  const tokens = await client.authorizationCodeGrant(config, callbackUrl, {
    pkceCodeVerifier: verifier,
    expectedState: state,
  });
  return { callbackUrl, tokens };
}

describe('idp-fake discovery and machine tokens', () => {
  it('when discovery is read, then it names the issuer and an end_session_endpoint', async () => {
    const response = await fetch(`${idp.issuer}/.well-known/openid-configuration`);
    const metadata = (await response.json()) as Record<string, unknown>;
    expect(metadata.issuer).toBe(idp.issuer);
    expect(metadata.end_session_endpoint).toBe(`${idp.issuer}/session/end`);
    expect(metadata.scopes_supported).toContain('roles');
  });

  it('when demo-station asks for test-runs:write, then a JWKS-verifiable at+jwt for the API comes back', async () => {
    const token = await accessToken('demo-station', { scope: 'test-runs:write' });
    const jwks = createRemoteJWKSet(new URL(`${idp.issuer}/jwks`));
    const { payload, protectedHeader } = await jwtVerify(token, jwks, {
      issuer: idp.issuer,
      audience: API_AUDIENCE,
      typ: 'at+jwt',
    });
    expect(protectedHeader.alg).toBe('RS256');
    expect(String(payload.scope).split(' ')).toContain('test-runs:write');
    expect(payload.client_id).toBe('demo-station');
  });

  it('when resource urn:other:api is requested, then the token is for that other audience', async () => {
    const token = await accessToken('demo-station', { scope: 'test-runs:write', resource: 'urn:other:api' });
    expect(decodeJwt(token).aud).toBe('urn:other:api');
  });

  it('when an unknown resource is requested, then the IdP answers invalid_target', async () => {
    const response = await clientCredentials('demo-station', { scope: 'test-runs:write', resource: 'urn:unknown:api' });
    expect(response.status).toBe(400);
    expect(((await response.json()) as { error: string }).error).toBe('invalid_target');
  });

  it('when demo-integration asks for test-runs:write, then it is refused with invalid_scope', async () => {
    const response = await clientCredentials('demo-integration', { scope: 'test-runs:write' });
    expect(response.status).toBe(400);
    expect(((await response.json()) as { error: string }).error).toBe('invalid_scope');
  });

  it('when demo-integration asks for records:read, then its token carries only that scope', async () => {
    const token = await accessToken('demo-integration', { scope: 'records:read' });
    expect(decodeJwt(token).scope).toBe('records:read');
  });

  it('when short-lived-station gets a token, then it expires one second after issue', async () => {
    const { exp, iat } = decodeJwt(await accessToken('short-lived-station', { scope: 'test-runs:write' }));
    expect(Number(exp) - Number(iat)).toBe(1);
  });
});

describe('idp-fake browser sign-in', () => {
  it('when operator signs in with code + PKCE, then the ID token carries name, email and roles', async () => {
    const config = await discoverWebClient();
    const { callbackUrl, tokens } = await signIn(new CookieJar(), config, 'operator');
    expect(callbackUrl.origin + callbackUrl.pathname).toBe(REDIRECT_URI);
    const claims = tokens.claims();
    expect(claims?.sub).toBe('operator');
    expect(claims?.name).toEqual(expect.any(String));
    expect(claims?.email).toBe('operator@plant.example');
    expect(claims?.roles).toEqual(['operator']);
  });

  it('when quality2 signs in, then the roles claim is ["quality"]', async () => {
    const { tokens } = await signIn(new CookieJar(), await discoverWebClient(), 'quality2');
    expect(tokens.claims()?.roles).toEqual(['quality']);
  });

  it('when the sign-in page is shown, then it is our own form with login, password and Sign in', async () => {
    const jar = new CookieJar();
    const config = await discoverWebClient();
    const page = await browse(jar, await openSignInPage(jar, config, client.randomPKCECodeVerifier(), 'x'));
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(page.headers.get('content-security-policy')).toContain("default-src 'none'");
    expect(html).toContain('Fluxtrail sign-in');
    expect(html).toContain('Demo identity provider — local accounts only');
    expect(html).toMatch(/<input[^>]*name="login"/);
    expect(html).toMatch(/<input[^>]*name="password"[^>]*type="password"/);
    expect(html).toMatch(/<button type="submit">Sign in<\/button>/);
  });

  it('when the password is wrong, then the form comes back with "Wrong login or password."', async () => {
    const jar = new CookieJar();
    const config = await discoverWebClient();
    const signInUrl = await openSignInPage(jar, config, client.randomPKCECodeVerifier(), 'x');
    const response = await postForm(jar, `${signInUrl}/login`, { login: 'quality', password: 'nope' });
    const html = await response.text();
    expect(response.status).toBe(401);
    expect(html).toContain('Wrong login or password.');
    expect(html).toContain('value="quality"');
  });

  it('when an unknown login is used, then the same message is shown', async () => {
    const jar = new CookieJar();
    const config = await discoverWebClient();
    const signInUrl = await openSignInPage(jar, config, client.randomPKCECodeVerifier(), 'x');
    const response = await postForm(jar, `${signInUrl}/login`, { login: 'nobody', password: 'fluxtrail' });
    expect(await response.text()).toContain('Wrong login or password.');
  });

  it('when the app sends the user to end_session, then our page auto-submits and lands on signed-out', async () => {
    const jar = new CookieJar();
    const config = await discoverWebClient();
    const { tokens } = await signIn(jar, config, 'auditor');
    const endSessionUrl = client.buildEndSessionUrl(config, {
      id_token_hint: tokens.id_token ?? '',
      post_logout_redirect_uri: `${APP_BASE}/signed-out`,
    });
    const page = await browse(jar, endSessionUrl.href);
    const html = await page.text();
    expect(html).toContain('getElementById(\'op.logoutForm\').submit()');
    expect(html).toContain('name="logout" value="yes"');
    expect(html).toMatch(/<button type="submit" form="op.logoutForm">Sign out<\/button>/);

    const action = /<form id="op.logoutForm" method="post" action="([^"]+)"/.exec(html)?.[1] ?? '';
    const xsrf = /name="xsrf" value="([^"]+)"/.exec(html)?.[1] ?? '';
    const confirmed = await postForm(jar, new URL(action, idp.issuer).href, { xsrf, logout: 'yes' });
    expect(locationOf(confirmed, idp.issuer)).toBe(`${APP_BASE}/signed-out`);

    // The IdP session is gone: a new authorization request asks for the password again.
    const again = await browse(jar, await openSignInPage(jar, config, client.randomPKCECodeVerifier(), 'y'));
    expect(await again.text()).toContain('Fluxtrail sign-in');
  });
});
