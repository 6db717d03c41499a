import type { ZodError } from 'zod';

export type FieldError = { field: string; message: string };

/** The one error model: a status, a stable code, a message, and optionally the fields at fault. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldError[],
  ) {
    super(message);
  }
}

/** `results[3].value` from zod's path ['results', 3, 'value']. */
export function fieldPath(path: ReadonlyArray<PropertyKey>): string {
  return path.reduce<string>((acc, part) => {
    if (typeof part === 'number') return `${acc}[${part}]`;
    return acc ? `${acc}.${String(part)}` : String(part);
  }, '');
}

export const badRequest = (message: string, fields?: FieldError[]) => new AppError(400, 'bad_request', message, fields);
export const invalid = (fields: FieldError[], message = 'The request has invalid fields.') =>
  new AppError(422, 'validation_failed', message, fields);
export const fromZod = (error: ZodError) =>
  invalid(error.issues.map((issue) => ({ field: fieldPath(issue.path) || '(body)', message: issue.message })));
export const unauthenticated = (message = 'Sign in first.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role may not do this.') => new AppError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new AppError(404, 'not_found', message);
export const conflict = (message: string, fields?: FieldError[]) => new AppError(409, 'conflict', message, fields);
export const payloadTooLarge = (message: string) => new AppError(413, 'payload_too_large', message);
export const unavailable = (message: string) => new AppError(503, 'unavailable', message);
