import type { RequestHandler } from 'express';
import { HttpError } from '../http-error';
import { isReadMethod } from '../middleware/require-user';
import { findTokenUser } from '../services/access-tokens';

/**
 * Where a script's token may never reach, whatever its scope: sign-in and sessions, the tokens themselves,
 * and changes to people (members, invitations, admin rights). Paths are relative to /api.
 */
function isOffLimits(method: string, path: string): boolean {
  if (/^\/(auth|account)(\/|$)/.test(path)) return true;
  if (isReadMethod(method)) return false;
  return /^\/organisation(\/|$)/.test(path) || /^\/crafts\/[^/]+\/members(\/|$)/.test(path);
}

/**
 * `Authorization: Bearer <secret>` signs a script in as the token's person for this request only: no session,
 * no cookie, and so no CSRF token (nothing a browser sends by itself). 401 invalid_token for an unknown or
 * revoked secret, 403 token_not_allowed off limits, 403 token_scope for a write with a read token.
 * Mount on /api before the session.
 */
export const bearerAuth: RequestHandler = async (req, _res, next) => {
  const header = req.get('authorization');
  if (header === undefined || !/^bearer /i.test(header)) return next();
  const found = await findTokenUser(header.slice('bearer '.length).trim());
  if (!found) throw new HttpError(401, 'invalid_token', 'The access token is unknown or revoked');
  if (isOffLimits(req.method, req.path)) {
    throw new HttpError(403, 'token_not_allowed', 'Access tokens cannot sign in, manage tokens or change people; use the web app');
  }
  if (found.token.scope === 'read' && !isReadMethod(req.method)) {
    throw new HttpError(403, 'token_scope', 'This access token may only read; create a read-write token to change data');
  }
  req.user = found.user;
  req.accessToken = { id: found.token.id, scope: found.token.scope };
  next();
};

/** The handlers, skipped for a request signed in by access token (sessions and CSRF are for browsers). */
export function unlessBearer(handlers: RequestHandler | RequestHandler[]): RequestHandler[] {
  return [handlers].flat().map(
    (handler): RequestHandler =>
      (req, res, next) =>
        req.accessToken ? next() : handler(req, res, next),
  );
}
