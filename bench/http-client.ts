import { Client, Pool } from 'undici';

// The stands' side of the benchmark. It shares the two cores with the app and MariaDB, so it
// should cost as little CPU per request as a client can: undici's own request API (not fetch),
// one kept-alive connection per stand.

export type HttpAnswer = { status: number; body: string };
export type Stand = Client;

const pools = new Map<string, Pool>();

function poolFor(origin: string): Pool {
  let pool = pools.get(origin);
  if (!pool) {
    pool = new Pool(origin, { connections: 16 });
    pools.set(origin, pool);
  }
  return pool;
}

/** One request; resolves with the status and the whole body as text. Through `stand` if given. */
export async function httpRequest(url: string, options: { method?: 'GET' | 'POST'; token?: string; json?: unknown; stand?: Stand } = {}): Promise<HttpAnswer> {
  const target = new URL(url);
  const body = options.json === undefined ? undefined : JSON.stringify(options.json);
  const headers: Record<string, string> = {};
  if (options.token) headers.authorization = `Bearer ${options.token}`;
  if (body !== undefined) headers['content-type'] = 'application/json';
  const dispatcher = options.stand ?? poolFor(target.origin);
  const response = await dispatcher.request({
    path: `${target.pathname}${target.search}`, method: options.method ?? (body === undefined ? 'GET' : 'POST'), headers, body,
  });
  return { status: response.statusCode, body: await response.body.text() };
}

/**
 * One kept-alive connection per stand, opened one after the other: the app's processes take turns
 * accepting connections, so stands that connect at different times (as real ones do) spread over
 * them evenly, where a burst of simultaneous connects would mostly land on one process.
 */
export async function connectStands(appUrl: string, count: number): Promise<Stand[]> {
  const stands: Stand[] = [];
  for (let i = 0; i < count; i++) {
    const stand = new Client(new URL(appUrl).origin, { keepAliveTimeout: 60_000 });
    await httpRequest(`${appUrl}/api/health`, { stand });
    await new Promise((resolve) => setTimeout(resolve, 20));
    stands.push(stand);
  }
  return stands;
}
