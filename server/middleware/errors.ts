import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from '../http-error';

/** JSON 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (req) => {
  throw new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}`);
};

interface BodyParserError {
  type?: string;
  status?: number;
  message?: string;
}

/** Turns every error into { error: { code, message, details? } }; never a stack trace to the client. */
export const errorHandler: ErrorRequestHandler = (error: unknown, req, res, _next) => {
  let httpError: HttpError;
  const parserError = error as BodyParserError;
  if (error instanceof HttpError) httpError = error;
  else if (parserError?.type === 'entity.parse.failed') httpError = new HttpError(400, 'invalid_json', 'The request body is not valid JSON');
  else if (parserError?.type === 'entity.too.large') httpError = new HttpError(413, 'too_large', 'The request body is too large');
  else if (parserError?.status === 403 && /csrf/i.test(parserError.message ?? '')) {
    httpError = new HttpError(403, 'invalid_csrf_token', 'The CSRF token is missing or wrong; reload the page and try again');
  } else {
    console.error(`Unhandled error on ${req.method} ${req.originalUrl}:`, error);
    httpError = new HttpError(500, 'internal', 'Something went wrong on the server; nothing was saved');
  }
  if (res.headersSent) return;
  res.status(httpError.status).json({
    error: { code: httpError.code, message: httpError.message, ...(httpError.details ? { details: httpError.details } : {}) },
  });
};
