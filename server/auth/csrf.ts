import { doubleCsrf } from 'csrf-csrf';
import type { Request, RequestHandler, Response } from 'express';
import type { Config } from '../env';

export interface Csrf {
  protection: RequestHandler;
  /** Issues (or reuses) the token bound to this session and sets its cookie. */
  issueToken(req: Request, res: Response): string;
}

/**
 * Double-submit CSRF tokens: every request but GET/HEAD/OPTIONS must carry the token in `x-csrf-token`. A signed-in
 * person's token is bound to their session; an anonymous visitor's to no session, since none is stored for them
 * (it stops being valid at sign-in, which gives a new session: the web app asks for a new token then). The
 * rejection is csrf-csrf's 403 "invalid csrf token" error, which the error middleware turns into `invalid_csrf_token`.
 */
export function createCsrf(config: Config): Csrf {
  const { doubleCsrfProtection, generateCsrfToken } = doubleCsrf({
    getSecret: () => config.session.secret,
    getSessionIdentifier: (req) => (req.user ? req.session.id : 'anonymous'),
    // The session cookie's name carries the __Host- prefix on HTTPS, and so does this one.
    cookieName: `${config.session.cookieName}.csrf`,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' },
    ignoredMethods: ['GET', 'HEAD', 'OPTIONS'],
    getCsrfTokenFromRequest: (req) => req.get('x-csrf-token'),
  });
  return {
    protection: doubleCsrfProtection,
    issueToken: (req, res) => generateCsrfToken(req, res),
  };
}
