import { Agent, request } from 'node:http';

// The stands' side of the benchmark: node:http with kept-alive sockets. It shares the two cores
// with the app and MariaDB, so it should cost as little CPU per request as a client can.

export type HttpAnswer = { status: number; body: string };

const sharedAgent = new Agent({ keepAlive: true, maxSockets: 16 });

/** One request; resolves with the status and the whole body as text. */
export function httpRequest(url: string, options: { method?: string; token?: string; json?: unknown; agent?: Agent } = {}): Promise<HttpAnswer> {
  const body = options.json === undefined ? undefined : JSON.stringify(options.json);
  const headers: Record<string, string> = {};
  if (options.token) headers.authorization = `Bearer ${options.token}`;
  if (body !== undefined) {
    headers['content-type'] = 'application/json';
    headers['content-length'] = String(Buffer.byteLength(body));
  }
  return new Promise((resolve, reject) => {
    const req = request(url, { method: options.method ?? (body === undefined ? 'GET' : 'POST'), headers, agent: options.agent ?? sharedAgent }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8') }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end(body);
  });
}

/**
 * One kept-alive connection per stand, opened one after the other: the app's processes take turns
 * accepting connections, so stands that connect at different times (as real ones do) spread over
 * them evenly, where a burst of simultaneous connects would mostly land on one process.
 */
export async function connectStands(appUrl: string, count: number): Promise<Agent[]> {
  const stands: Agent[] = [];
  for (let i = 0; i < count; i++) {
    const agent = new Agent({ keepAlive: true, maxSockets: 1 });
    await httpRequest(`${appUrl}/api/health`, { agent });
    await new Promise((resolve) => setTimeout(resolve, 20));
    stands.push(agent);
  }
  return stands;
}
