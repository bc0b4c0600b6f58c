import { doubleCsrf } from 'csrf-csrf';
import type { Request, RequestHandler, Response } from 'express';
import type { Config } from '../env';

export interface Csrf {
  protection: RequestHandler;
  /** Issues (or reuses) the token bound to this session and sets its cookie. */
  issueToken(req: Request, res: Response): string;
}

/**
 * Double-submit CSRF tokens bound to the session identifier: every request but GET/HEAD/OPTIONS must
 * carry the token in `x-csrf-token`. The rejection is csrf-csrf's 403 "invalid csrf token" error, which
 * the error middleware turns into `invalid_csrf_token`.
 */
export function createCsrf(config: Config): Csrf {
  // Browsers accept a __Host- cookie only when it is Secure, so the prefix goes with HTTPS.
  const cookieName = `${config.secureCookies ? '__Host-' : ''}${config.session.cookieName}.csrf`;
  const { doubleCsrfProtection, generateCsrfToken } = doubleCsrf({
    getSecret: () => config.session.secret,
    getSessionIdentifier: (req) => req.session.id,
    cookieName,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' },
    ignoredMethods: ['GET', 'HEAD', 'OPTIONS'],
    getCsrfTokenFromRequest: (req) => req.get('x-csrf-token'),
  });
  return {
    protection: doubleCsrfProtection,
    issueToken(req, res) {
      // An unsaved session gets a new identifier on the next request, which would void the token.
      req.session.csrfIssued = true;
      return generateCsrfToken(req, res);
    },
  };
}
