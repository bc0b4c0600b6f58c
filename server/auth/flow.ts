import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Sequelize } from 'sequelize';
import type { SessionResponse, SessionUser, SignInErrorCode } from '@/shared/schemas/session';
import type { Config } from '../env';
import { currentUser } from '../middleware/require-user';
import type { User } from '../models';
import type { SignInProvider } from '../services/sign-in';
import type { Csrf } from './csrf';
import type { Passport } from './session';
import type { SignInRefusal } from './strategies';

const providers: SessionResponse['providers'] = [
  { id: 'google', label: 'Google', startUrl: '/api/auth/google' },
  { id: 'sso', label: 'Company SSO', startUrl: '/api/auth/sso' },
];

const SIGNED_IN_HOME = '/crafts';
const failureUrl = (code: SignInErrorCode) => `/sign-in?error=${code}`;

function toSessionUser(user: User): SessionUser {
  if (!user.organisation) throw new Error(`Signed-in person ${user.id} was loaded without their organisation`);
  const { id, name, email, isOrgAdmin, organisation } = user;
  return { id, name, email, isOrgAdmin, organisation: { id: organisation.id, name: organisation.name } };
}

/** GET /session: who is signed in, a CSRF token bound to this session, and the sign-in providers. */
export function sessionInfo(csrf: Csrf): RequestHandler {
  return (req, res) => {
    const body: SessionResponse = { user: req.user ? toSessionUser(req.user) : null, csrfToken: csrf.issueToken(req, res), providers };
    res.set('Cache-Control', 'no-store').json(body);
  };
}

/** Sign-in attempts per IP in 15 minutes; a start and its callback each count once against their own limit. */
export function signInRateLimit(config: Config): RequestHandler {
  return rateLimit({
    windowMs: 15 * 60_000,
    limit: config.signInRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // These are full-page navigations, so the answer is the sign-in page with a message, not JSON.
    handler: (_req, res) => res.redirect(failureUrl('too_many_requests')),
  });
}

function isRefusal(info: unknown): info is SignInRefusal {
  return typeof info === 'object' && info !== null && 'code' in info && typeof info.code === 'string';
}

/** A refusal from the provider's side: a lost or forged state, or the person declined at the provider. */
function refusalCode(info: unknown): SignInErrorCode {
  if (isRefusal(info)) return info.code;
  const message = typeof info === 'object' && info !== null && 'message' in info ? String(info.message) : '';
  return /state/i.test(message) ? 'state_mismatch' : 'access_denied';
}

/** An error and its causes, outermost first: openid-client wraps the telling message in a generic one. */
function errorChain(error: unknown): string[] {
  const messages: string[] = [];
  for (let cause = error; cause instanceof Error; cause = cause.cause) messages.push(cause.message);
  return messages.length > 0 ? messages : [String(error)];
}

/** openid-client reports a state that does not match the one it sent as an invalid response. */
const isStateMismatch = (error: unknown) => errorChain(error).some((message) => message.includes('"state"'));

/**
 * GET /<provider> and /<provider>/callback: the first redirects to the provider; the callback completes the
 * sign-in and redirects to /crafts, or to /sign-in?error=<code> when it fails.
 */
export function signInWith(passport: Passport, provider: SignInProvider): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const authenticate = passport.authenticate(provider, (error: unknown, user: Express.User | false | undefined, info: unknown) => {
      if (error) {
        const code = isStateMismatch(error) ? 'state_mismatch' : 'provider_error';
        console.warn(`[auth] ${provider} sign-in failed (${code}): ${errorChain(error).join(': ')}`);
        res.redirect(failureUrl(code));
        return;
      }
      if (!user) {
        res.redirect(failureUrl(refusalCode(info)));
        return;
      }
      req.logIn(user, (loginError) => (loginError ? next(loginError) : res.redirect(SIGNED_IN_HOME)));
    }) as RequestHandler;
    authenticate(req, res, next);
  };
}

/** Runs before the SSO routes: makes sure the strategy exists, or sends the person back with provider_error. */
export function requireStrategy(load: () => Promise<void>): RequestHandler {
  return async (_req, res, next) => {
    try {
      await load();
    } catch (error) {
      console.warn(`[auth] SSO discovery failed: ${errorChain(error).join(': ')}`);
      res.redirect(failureUrl('provider_error'));
      return;
    }
    next();
  };
}

function logOut(req: Request) {
  return new Promise<void>((resolve, reject) => req.logout((error) => (error ? reject(error) : resolve())));
}

/** POST /sign-out: ends this session (a no-op when nobody is signed in); 204. */
export function signOut(config: Config): RequestHandler {
  return async (req, res) => {
    await logOut(req);
    res.clearCookie(config.session.cookieName, { path: '/' }).status(204).end();
  };
}

/** POST /sign-out-everywhere: ends every session of the signed-in person, this one included; 204. */
export function signOutEverywhere(config: Config, sequelize: Sequelize): RequestHandler {
  return async (req, res) => {
    const { id } = currentUser(req);
    await logOut(req);
    await sequelize.query(`DELETE FROM sessions WHERE sess -> 'passport' ->> 'user' = $1`, { bind: [id] });
    res.clearCookie(config.session.cookieName, { path: '/' }).status(204).end();
  };
}
