import type { Request } from 'express';
import { notFound } from '../../../errors.js';

/** A named path segment as one string; Express 5 types allow arrays for wildcard segments. */
export function pathParam(req: Request, name: string): string {
  const value: unknown = req.params[name];
  if (typeof value !== 'string' || value.length === 0) throw notFound(`Missing ${name} in the path.`);
  return value;
}
