import type { z } from 'zod';
import { apiErrorSchema, fieldErrorSchema, type FieldError } from '@/shared/schemas/common';
import { sessionResponseSchema } from '@/shared/schemas/session';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Same origin unless the build names another API host. */
const baseUrl = process.env.EXPO_PUBLIC_API_URL ?? '';

/** The full address of an API path, for clients other than fetch (the EventSource of an events stream). */
export function apiUrl(path: string): string {
  return `${baseUrl}${path}`;
}

/** A failed API call: the HTTP status and the server's `{ error: { code, message, details } }`. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }

  /** The field-by-field validation details, if the server sent any in the shared FieldError shape. */
  get fieldErrors(): FieldError[] {
    const parsed = fieldErrorSchema.array().safeParse(this.details);
    return parsed.success ? parsed.data : [];
  }
}

let csrfToken: string | null = null;

/** Remembers the CSRF token from the latest session response; state-changing requests send it back. */
export function rememberCsrfToken(token: string | null): void {
  csrfToken = token;
}

async function currentCsrfToken(): Promise<string> {
  if (csrfToken !== null) return csrfToken;
  // No session fetched yet (or it was forgotten at sign-out): fetch one just for the token.
  const session = await apiRequest('GET', '/api/auth/session', { schema: sessionResponseSchema });
  csrfToken = session.csrfToken;
  return session.csrfToken;
}

export type RequestOptions<S extends z.ZodType | undefined> = {
  body?: unknown;
  /** Parses the response body; leave out for responses without a body (204). */
  schema?: S;
};

type Result<S> = S extends z.ZodType ? z.output<S> : undefined;

/**
 * Calls the Trimsheet API: JSON in and out, cookies included, the CSRF header on state-changing requests.
 * Resolves with the response parsed by `schema`; rejects with an ApiError for error responses, network
 * failures (status 0) and responses that do not match the schema.
 */
export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  method: Method,
  path: string,
  options: RequestOptions<S> = {},
): Promise<Result<S>> {
  return withFreshCsrfToken(() => send(method, path, options));
}

/** Runs the call; a token from before a sign-in or sign-out elsewhere is void: fetch the current one and try once more. */
async function withFreshCsrfToken<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    if (!(error instanceof ApiError && error.code === 'invalid_csrf_token')) throw error;
    rememberCsrfToken(null);
    return call();
  }
}

async function send<S extends z.ZodType | undefined>(
  method: Method,
  path: string,
  { body, schema }: RequestOptions<S>,
): Promise<Result<S>> {
  const headers: Record<string, string> = { accept: 'application/json' };
  if (body !== undefined) headers['content-type'] = 'application/json';
  if (method !== 'GET') headers['x-csrf-token'] = await currentCsrfToken();

  let response: Response;
  try {
    response = await fetch(apiUrl(path), {
      method,
      headers,
      credentials: 'include',
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch (cause) {
    const reason = cause instanceof Error ? cause.message : String(cause);
    throw new ApiError(0, 'network_error', `Could not reach the server (${method} ${path}): ${reason}`);
  }

  return answerOf(response.status, await response.text(), schema as S, method, path);
}

/** The reply parsed by `schema`, or the ApiError it stands for. */
function answerOf<S extends z.ZodType | undefined>(status: number, text: string, schema: S, method: Method, path: string): Result<S> {
  const payload = readJson(text);
  if (status < 200 || status > 299) throw toApiError(status, payload, method, path);
  if (schema === undefined) return undefined as Result<S>;

  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    const where = parsed.error.issues[0]?.path.join('.') || '(root)';
    throw new ApiError(status, 'unexpected_response', `The server's answer to ${method} ${path} was not understood at "${where}".`);
  }
  return parsed.data as Result<S>;
}

function readJson(text: string): unknown {
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return text;
  }
}

/**
 * Sends a form with a file (multipart/form-data) to the API with cookies and the CSRF header, telling
 * `onProgress` the fraction sent so far; resolves and rejects as `apiRequest` does. XMLHttpRequest, because
 * fetch does not report an upload's progress.
 */
export async function apiUpload<S extends z.ZodType>(
  path: string,
  form: FormData,
  { schema, onProgress }: { schema: S; onProgress?: (fraction: number) => void },
): Promise<z.output<S>> {
  const send = async () => {
    const token = await currentCsrfToken();
    const { status, text } = await new Promise<{ status: number; text: string }>((resolve, reject) => {
      const request = new XMLHttpRequest();
      request.open('POST', apiUrl(path));
      request.withCredentials = true;
      request.setRequestHeader('accept', 'application/json');
      request.setRequestHeader('x-csrf-token', token);
      request.upload.onprogress = (event) => {
        if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
      };
      // A small file may go in one piece without a progress event: all of it is sent once the upload loads.
      request.upload.onload = () => onProgress?.(1);
      request.onload = () => resolve({ status: request.status, text: request.responseText });
      request.onerror = () => reject(new ApiError(0, 'network_error', `Could not reach the server (POST ${path})`));
      request.send(form);
    });
    return answerOf(status, text, schema, 'POST', path) as z.output<S>;
  };
  return withFreshCsrfToken(send);
}

function toApiError(status: number, payload: unknown, method: Method, path: string): ApiError {
  const parsed = apiErrorSchema.safeParse(payload);
  if (parsed.success) {
    const { code, message, details } = parsed.data.error;
    return new ApiError(status, code, message, details);
  }
  return new ApiError(status, 'http_error', `${method} ${path} failed with HTTP ${status}.`);
}
