import type { Request } from 'express';

/** A named path segment as one string (Express 5 types wildcard segments as arrays). */
export function param(req: Request, name: string): string {
  const value = req.params[name];
  return Array.isArray(value) ? value.join('/') : String(value);
}
