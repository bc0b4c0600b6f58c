import cookieParser from 'cookie-parser';
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../env';
import { createCsrf } from './csrf';
import { authRouter } from './router';
import { createPassport, PostgresSessionStore, recentSessionReads, sessionMiddleware } from './session';
import { googleStrategy, ssoStrategyLoader } from './strategies';

export interface Auth {
  /**
   * What a browser's request goes through, in one router: cookies, the session and passport, and the CSRF
   * check on every state-changing request. Mount on /api before the API routes.
   */
  browser: Router;
  /** The /api/auth routes. */
  router: Router;
}

/** Builds sign-in for one app: sessions in PostgreSQL, Google and company SSO through passport, CSRF tokens. */
export function createAuth({ config, sequelize }: { config: Config; sequelize: Sequelize }): Auth {
  const store = new PostgresSessionStore(sequelize, config.session);
  const passport = createPassport();
  passport.use(googleStrategy(config));
  const csrf = createCsrf(config);
  return {
    browser: Router().use(
      recentSessionReads(config, store),
      cookieParser(),
      sessionMiddleware(config, store),
      passport.initialize(),
      passport.session(),
      csrf.protection,
    ),
    router: authRouter({ config, sequelize, passport, csrf, loadSso: ssoStrategyLoader(passport, config) }),
  };
}
