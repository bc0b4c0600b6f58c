import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Sequelize } from 'sequelize';
import type { IdentityLinkResult, SessionResponse, SessionUser, SignInErrorCode, SignInProvider } from '@/shared/schemas/session';
import type { Config } from '../env';
import { rateLimit } from '../middleware/rate-limit';
import { currentUser } from '../middleware/require-user';
import type { User } from '../models';
import type { Csrf } from './csrf';
import { endEverySession, endSession, type Passport } from './session';
import { chooseInvitation, forgetInvitationChoice, identityLinkAt, invitationChoiceOf, settleIntents } from './sign-in-intents';
import type { IdentityLinkInfo, SignInRefusal } from './strategies';

const providers: SessionResponse['providers'] = [
  { id: 'google', label: 'Google', startUrl: '/api/auth/google' },
  { id: 'sso', label: 'Company SSO', startUrl: '/api/auth/sso' },
];

const SIGNED_IN_HOME = '/crafts';
const failureUrl = (code: SignInErrorCode) => `/sign-in?error=${code}`;
/** Where a request to link another sign-in ends: the account screen, saying how it went. */
const linkResultUrl = (provider: SignInProvider, result: IdentityLinkResult) => `/account?link=${result}&provider=${provider}`;

function toSessionUser(user: User): SessionUser {
  if (!user.organisation) throw new Error(`Signed-in person ${user.id} was loaded without their organisation`);
  const { id, name, email, isOrgAdmin, organisation } = user;
  return { id, name, email, isOrgAdmin, organisation: { id: organisation.id, name: organisation.name } };
}

/** GET /session: who is signed in, a CSRF token bound to this session, and the sign-in providers. */
export function sessionInfo(csrf: Csrf): RequestHandler {
  return (req, res) => {
    const body: SessionResponse = {
      user: req.user ? toSessionUser(req.user) : null,
      csrfToken: csrf.issueToken(req, res),
      providers,
      invitationChoice: req.user ? null : invitationChoiceOf(req),
    };
    res.set('Cache-Control', 'no-store').json(body);
  };
}

/**
 * Sign-in attempts per client address in 15 minutes, counted in PostgreSQL (shared by every API process); starts
 * and callbacks count apart (`name`).
 */
export function signInRateLimit(config: Config, sequelize: Sequelize, name: 'sign_in_start' | 'sign_in_callback'): RequestHandler {
  return rateLimit(sequelize, {
    name,
    limit: config.signInRateLimit,
    windowMs: 15 * 60_000,
    what: 'sign-in attempts',
    // These are full-page navigations, so the answer is the sign-in page with a message, not JSON.
    onLimited: (_req, res) => res.redirect(failureUrl('too_many_requests')),
  });
}

function isLinkInfo(info: unknown): info is IdentityLinkInfo {
  return typeof info === 'object' && info !== null && 'link' in info && typeof info.link === 'string';
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

/** A provider-side failure of a link request: the same codes, on the account screen. */
function linkFailure(code: SignInErrorCode): IdentityLinkResult {
  return code === 'state_mismatch' || code === 'access_denied' || code === 'too_many_requests' ? code : 'provider_error';
}

/**
 * GET /<provider> and /<provider>/callback: the first redirects to the provider (with `?invitation=<id>`, the
 * invitation chosen from those offered to this browser); the callback completes the sign-in and redirects to
 * /crafts, or to /sign-in?error=<code> when it fails. A callback answering the signed-in person's request to
 * link this provider links it instead and redirects to /account?link=<result>&provider=<provider>.
 */
export function signInWith(passport: Passport, provider: SignInProvider): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const atCallback = req.path.endsWith('/callback');
    if (!atCallback) chooseInvitation(req, req.query.invitation);
    const linking = atCallback && identityLinkAt(req, provider) !== undefined;
    const fail = (code: SignInErrorCode) => {
      settleIntents(req);
      res.redirect(linking ? linkResultUrl(provider, linkFailure(code)) : failureUrl(code));
    };
    const authenticate = passport.authenticate(provider, (error: unknown, user: Express.User | false | undefined, info: unknown) => {
      if (error) {
        const code = isStateMismatch(error) ? 'state_mismatch' : 'provider_error';
        console.warn(`[auth] ${provider} sign-in failed (${code}): ${errorChain(error).join(': ')}`);
        fail(code);
        return;
      }
      if (isLinkInfo(info)) {
        settleIntents(req);
        res.redirect(linkResultUrl(provider, info.link));
        return;
      }
      if (!user) {
        fail(refusalCode(info));
        return;
      }
      settleIntents(req);
      forgetInvitationChoice(req);
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

/** POST /sign-out: ends this session (a no-op when nobody is signed in); 204 with only the cleared cookie. */
export function signOut(config: Config): RequestHandler {
  return async (req, res) => {
    await endSession(config, req, res);
    res.status(204).end();
  };
}

/** POST /sign-out-everywhere: ends every session of the signed-in person, this one included; 204. */
export function signOutEverywhere(config: Config): RequestHandler {
  return async (req, res) => {
    await endEverySession(config, req, res, currentUser(req).id);
    res.status(204).end();
  };
}
