import type { FieldError } from '@/shared/schemas/common';

/** An error with an HTTP status and a stable code; the error middleware turns it into the API error shape. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: FieldError[] | Record<string, unknown>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

/** 404 not_found: "<what> was not found"; also used for what the caller may not see, so its existence does not leak. */
export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} was not found`);
/** 403 forbidden with the given message: the caller sees the thing but may not do this to it. */
export const forbidden = (message: string) => new HttpError(403, 'forbidden', message);
