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

export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} was not found`);
export const forbidden = (message: string) => new HttpError(403, 'forbidden', message);
