import type { RequestHandler } from 'express';
import { AppError } from '../errors.js';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cookie-authenticated writes must carry our custom header (which a cross-site form cannot send
 * without a CORS preflight we never grant) and, when the browser sends one, a same-origin Origin.
 * Bearer-token calls are not exposed to CSRF and skip the check.
 */
export function csrfProtection(allowedOrigins: readonly string[]): RequestHandler {
  return (req, _res, next) => {
    if (safeMethods.has(req.method) || req.get('authorization')) return next();
    if (req.get('x-fluxtrail-csrf') !== '1') {
      throw new AppError(403, 'csrf_failed', 'Missing the x-fluxtrail-csrf header on a cookie-authenticated write.');
    }
    const origin = req.get('origin');
    if (origin && !allowedOrigins.includes(origin)) {
      throw new AppError(403, 'csrf_failed', `Requests from origin ${origin} are not accepted.`);
    }
    next();
  };
}
