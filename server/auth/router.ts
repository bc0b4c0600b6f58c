import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../env';
import { requireUser } from '../middleware/require-user';
import type { Csrf } from './csrf';
import type { Passport } from './session';
import { requireStrategy, sessionInfo, signInRateLimit, signInWith, signOut, signOutEverywhere } from './flow';

export interface AuthRouterDeps {
  config: Config;
  sequelize: Sequelize;
  passport: Passport;
  csrf: Csrf;
  loadSso: () => Promise<void>;
}

/** The /api/auth routes. */
export function authRouter({ config, sequelize, passport, csrf, loadSso }: AuthRouterDeps): Router {
  const router = Router();
  const limitStarts = signInRateLimit(config, sequelize, 'sign_in_start');
  const limitCallbacks = signInRateLimit(config, sequelize, 'sign_in_callback');
  const ssoReady = requireStrategy(loadSso);

  // GET /api/auth/session: anyone; SessionResponse.
  router.get('/session', sessionInfo(csrf));
  // GET /api/auth/google[/callback]: anyone; redirects (to the provider, then /crafts or /sign-in?error=<code>).
  router.get('/google', limitStarts, signInWith(passport, 'google'));
  router.get('/google/callback', limitCallbacks, signInWith(passport, 'google'));
  // GET /api/auth/sso[/callback]: anyone; as Google, and provider_error while the identity provider is unreachable.
  router.get('/sso', limitStarts, ssoReady, signInWith(passport, 'sso'));
  router.get('/sso/callback', limitCallbacks, ssoReady, signInWith(passport, 'sso'));
  // POST /api/auth/sign-out: anyone (no-op when signed out); 204; 403 invalid_csrf_token.
  router.post('/sign-out', signOut(config));
  // POST /api/auth/sign-out-everywhere: signed in; 204; 401 unauthenticated, 403 invalid_csrf_token.
  router.post('/sign-out-everywhere', requireUser, signOutEverywhere(config));
  return router;
}
