import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ConnectionError } from 'sequelize';
import { HttpError } from '../http-error';

/** JSON 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (req) => {
  throw new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}`);
};

interface BodyParserError {
  type?: string;
  status?: number;
  message?: string;
  /** Sequelize's wrap of a PostgreSQL error: `parent.code` is its SQLSTATE. */
  parent?: { code?: string };
}

/** Errors of reading a request that say what was wrong with it: 4xx, in the one error shape, with our own words. */
const unreadable: Readonly<Record<string, { status: number; code: string; message: string }>> = {
  'charset.unsupported': { status: 415, code: 'unsupported_charset', message: 'The request body must be UTF-8' },
  'encoding.unsupported': {
    status: 415,
    code: 'unsupported_encoding',
    message: 'The request body must be sent plain, gzip, deflate or br',
  },
  'request.aborted': { status: 400, code: 'unreadable_body', message: 'The request body ended early' },
  'request.size.invalid': { status: 400, code: 'unreadable_body', message: 'The request body is not as long as it says' },
};

/** The 4xx for an error that was the request's fault, or undefined for one that was the server's. */
function requestFault(error: BodyParserError): HttpError | undefined {
  const known = error.type === undefined ? undefined : unreadable[error.type];
  if (known) return new HttpError(known.status, known.code, known.message);
  // A path whose % escapes do not decode (the router marks it 400).
  if (error instanceof URIError) return new HttpError(400, 'invalid_path', 'The address has a malformed % escape');
  // Any other refusal of the request by the body reader (a compressed body that does not inflate, say).
  if (typeof error.status === 'number' && error.status >= 400 && error.status < 500) {
    return new HttpError(error.status, 'unreadable_body', 'The request body could not be read');
  }
  // PostgreSQL refusing a value (SQLSTATE class 22, data exception) that the schemas let through.
  if (error.parent?.code?.startsWith('22')) return new HttpError(400, 'invalid_input', 'A value in the request cannot be stored');
  return undefined;
}

/** SQLSTATEs and socket errors that mean PostgreSQL is gone or not accepting connections, not that the query was wrong. */
const unavailableCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ENOTFOUND', '57P01', '57P02', '57P03', '53300']);

/** Whether the error says the database cannot be reached (refused, shut down, connection cut), for a 503. */
function databaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true;
  const wrapped = error as { code?: string; message?: string; parent?: { code?: string; message?: string } } | undefined;
  return [wrapped, wrapped?.parent].some(
    (candidate) =>
      (candidate?.code !== undefined && (unavailableCodes.has(candidate.code) || candidate.code.startsWith('08'))) ||
      /^Connection terminated|not queryable/.test(candidate?.message ?? ''),
  );
}

/** Turns every error into { error: { code, message, details? } }; never a stack trace to the client. */
export const errorHandler: ErrorRequestHandler = (error: unknown, req, res, _next) => {
  let httpError: HttpError;
  let fault: HttpError | undefined;
  const parserError = error as BodyParserError;
  if (error instanceof HttpError) httpError = error;
  else if (parserError?.type === 'entity.parse.failed')
    httpError = new HttpError(400, 'invalid_json', 'The request body is not valid JSON');
  else if (parserError?.type === 'entity.too.large') httpError = new HttpError(413, 'too_large', 'The request body is too large');
  else if (parserError?.status === 403 && /csrf/i.test(parserError.message ?? '')) {
    httpError = new HttpError(403, 'invalid_csrf_token', 'The CSRF token is missing or wrong; reload the page and try again');
  } else if (databaseUnavailable(error)) {
    httpError = new HttpError(503, 'database_unavailable', 'The database does not answer; try again in a moment');
    res.setHeader('Retry-After', '5');
    console.warn(`[trimsheet] ${req.method} ${req.originalUrl}: the database does not answer`);
  } else if ((fault = requestFault(parserError))) {
    httpError = fault;
    console.warn(`[trimsheet] refused ${req.method} ${req.originalUrl}: ${httpError.code}`);
  } else {
    console.error(`Unhandled error on ${req.method} ${req.originalUrl}:`, error);
    httpError = new HttpError(500, 'internal', 'Something went wrong on the server; nothing was saved');
  }
  if (res.headersSent) return;
  // A refusal before the body was read (not signed in, a bad CSRF token): hang up rather than read the rest of it
  // only to keep the connection, which would let anyone make the server read big bodies for nothing.
  if (!req.complete) res.setHeader('Connection', 'close');
  const retryAfter = httpError.details && 'retryAfterSeconds' in httpError.details ? httpError.details.retryAfterSeconds : undefined;
  if (httpError.status === 429 && typeof retryAfter === 'number') res.setHeader('Retry-After', String(retryAfter));
  res.status(httpError.status).json({
    error: { code: httpError.code, message: httpError.message, ...(httpError.details ? { details: httpError.details } : {}) },
  });
};
