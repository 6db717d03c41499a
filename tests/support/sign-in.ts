// Signs a demo account in through the real IdP fake and the app's real OIDC routes, with fetch
// and a small cookie jar per host, and returns the app's session cookie.

type Jar = Map<string, Map<string, string>>;

function remember(jar: Jar, url: URL, response: Response) {
  const cookies = jar.get(url.host) ?? new Map<string, string>();
  for (const header of response.headers.getSetCookie()) {
    const [pair] = header.split(';');
    const eq = pair.indexOf('=');
    cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
  }
  jar.set(url.host, cookies);
}

function cookieHeader(jar: Jar, url: URL): string {
  return [...(jar.get(url.host) ?? new Map()).entries()].map(([k, v]) => `${k}=${v}`).join('; ');
}

async function follow(jar: Jar, start: URL, init: RequestInit = {}, maxHops = 15): Promise<{ url: URL; response: Response }> {
  let url = start;
  let request = init;
  for (let hop = 0; hop < maxHops; hop++) {
    const response = await fetch(url, { ...request, redirect: 'manual', headers: { ...(request.headers ?? {}), cookie: cookieHeader(jar, url) } });
    remember(jar, url, response);
    const location = response.headers.get('location');
    if (response.status < 300 || response.status >= 400 || !location) return { url, response };
    url = new URL(location, url);
    request = {};
  }
  throw new Error('too many redirects during sign-in');
}

export async function signIn(appUrl: string, login: string, password = 'fluxtrail'): Promise<{ cookie: string; status: number; body: string }> {
  const jar: Jar = new Map();
  const { url: formUrl, response: formPage } = await follow(jar, new URL('/auth/login', appUrl));
  const html = await formPage.text();
  const action = /<form[^>]*action="([^"]+)"/i.exec(html)?.[1];
  if (!action) throw new Error(`no sign-in form at ${formUrl.href}`);
  const { response } = await follow(jar, new URL(action.replace(/&amp;/g, '&'), formUrl), {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ login, password }).toString(),
  });
  const appHost = new URL(appUrl).host;
  const sid = jar.get(appHost)?.get('fluxtrail.sid');
  return { cookie: sid ? `fluxtrail.sid=${sid}` : '', status: response.status, body: await response.text() };
}

/** A client-credentials access token from the IdP fake. */
export async function clientToken(idpUrl: string, clientId: string, secret: string, extra: Record<string, string> = {}): Promise<string> {
  const response = await fetch(new URL('/token', idpUrl), {
    method: 'POST',
    headers: {
      'content-type': 'application/x-www-form-urlencoded',
      authorization: `Basic ${Buffer.from(`${clientId}:${secret}`).toString('base64')}`,
    },
    body: new URLSearchParams({ grant_type: 'client_credentials', ...extra }).toString(),
  });
  const body = await response.json() as { access_token?: string; error?: string; error_description?: string };
  if (!body.access_token) throw new Error(`token request failed: ${body.error} ${body.error_description ?? ''}`);
  return body.access_token;
}
