import { z } from 'zod';

/** One field-level problem reported by the server, e.g. `{ field: 'results[3].value', message: 'Required' }`. */
export type FieldProblem = { field: string; message: string };

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldProblem[];

  constructor(status: number, code: string, message: string, fields: FieldProblem[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }

  get isUnauthenticated(): boolean {
    return this.status === 401;
  }

  get isForbidden(): boolean {
    return this.status === 403;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
  }),
});

async function errorFromResponse(response: Response): Promise<ApiError> {
  const body: unknown = await response.json().catch(() => undefined);
  const parsed = errorBodySchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(response.status, code, message, fields);
  }
  return new ApiError(response.status, `http_${response.status}`, response.statusText || 'Request failed');
}

type QueryParams = Record<string, string | number | boolean | undefined>;

type RequestOptions<T> = {
  schema: z.ZodType<T>;
  params?: QueryParams;
  body?: unknown;
  signal?: AbortSignal;
};

function withParams(path: string, params: QueryParams | undefined): string {
  if (!params) return path;
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined) search.set(key, String(value));
  }
  const query = search.toString();
  return query ? `${path}?${query}` : path;
}

function encodeBody(body: unknown): { body?: BodyInit; headers: Record<string, string> } {
  if (body === undefined) return { headers: {} };
  if (body instanceof FormData) return { body, headers: {} };
  return { body: JSON.stringify(body), headers: { 'content-type': 'application/json' } };
}

async function request<T>(method: string, path: string, options: RequestOptions<T>): Promise<T> {
  const encoded = encodeBody(options.body);
  const headers: Record<string, string> = { accept: 'application/json', ...encoded.headers };
  // The server rejects state-changing requests that lack this header (CSRF guard).
  if (method !== 'GET') headers['x-fluxtrail-csrf'] = '1';

  let response: Response;
  try {
    response = await fetch(withParams(path, options.params), {
      method,
      headers,
      body: encoded.body,
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network', 'The server could not be reached. Check the connection and try again.');
  }

  if (!response.ok) throw await errorFromResponse(response);

  const data: unknown = response.status === 204 ? undefined : await response.json();
  const parsed = options.schema.safeParse(data);
  if (!parsed.success) {
    throw new ApiError(response.status, 'unexpected_response', 'The server sent a response this screen does not understand.');
  }
  return parsed.data;
}

type WithoutBody<T> = Omit<RequestOptions<T>, 'body'>;

export const apiClient = {
  get: <T>(path: string, options: WithoutBody<T>) => request('GET', path, options),
  post: <T>(path: string, options: RequestOptions<T>) => request('POST', path, options),
  put: <T>(path: string, options: RequestOptions<T>) => request('PUT', path, options),
  patch: <T>(path: string, options: RequestOptions<T>) => request('PATCH', path, options),
  delete: <T>(path: string, options: WithoutBody<T>) => request('DELETE', path, options),
};
