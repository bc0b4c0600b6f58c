import type { RequestHandler, Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../env';
import { createCsrf } from './csrf';
import { authRouter } from './router';
import { createPassport, sessionMiddleware } from './session';
import { googleStrategy, ssoStrategyLoader } from './strategies';


export interface Auth {
  /** Session cookie and passport, in order; mount on /api after cookie-parser, before the API routes. */
  session: RequestHandler[];
  /** CSRF check on every state-changing request; mount on /api before the routers. */
  csrfProtection: RequestHandler;
  /** The /api/auth routes. */
  router: Router;
}

/** Builds sign-in for one app: sessions in PostgreSQL, Google and company SSO through passport, CSRF tokens. */
export function createAuth({ config, sequelize }: { config: Config; sequelize: Sequelize }): Auth {
  const passport = createPassport();
  passport.use(googleStrategy(config));
  const csrf = createCsrf(config);
  return {
    session: [sessionMiddleware(config, sequelize), passport.initialize(), passport.session()],
    csrfProtection: csrf.protection,
    router: authRouter({ config, sequelize, passport, csrf, loadSso: ssoStrategyLoader(passport, config) }),
  };
}
