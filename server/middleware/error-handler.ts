import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError, fromZod } from '../errors.js';

type BodyParserError = Error & { type?: string; status?: number };

/** Turns any error into `{ error: { code, message, fields? } }`; unknown errors are logged and hidden. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  let appError: AppError;
  if (err instanceof AppError) appError = err;
  else if (err instanceof ZodError) appError = fromZod(err);
  else if ((err as BodyParserError).type === 'entity.too.large') {
    appError = new AppError(413, 'payload_too_large', 'The request body is larger than this endpoint accepts.');
  } else if ((err as BodyParserError).type === 'entity.parse.failed') {
    appError = new AppError(400, 'malformed_json', 'The request body is not valid JSON.');
  } else {
    console.error(err);
    appError = new AppError(500, 'internal_error', 'Something went wrong on the server; it has been logged.');
  }
  const { status, code, message, fields } = appError;
  res.status(status).json({ error: { code, message, ...(fields ? { fields } : {}) } });
};

export const notFoundHandler: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: 'No such endpoint.' } });
};
