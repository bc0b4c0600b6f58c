import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import expressSession from 'express-session';
import passport from 'passport';
import { QueryTypes, type Sequelize } from 'sequelize';
import { idSchema } from '@/shared/schemas/common';
import type { Config } from '../env';
import { User } from '../models';

declare module 'express-session' {
  interface SessionData {
    /** Set when a CSRF token is issued, so the session (and the identifier the token is bound to) is stored. */
    csrfIssued?: boolean;
  }
}

/**
 * connect-pg-simple's pg-promise seam (`any(query, params)` → rows), served by Sequelize's own pool, so
 * sessions need no second pool and close with the database.
 */
function sessionQueries(sequelize: Sequelize) {
  return { any: (query: string, params: unknown[]) => sequelize.query(query, { bind: params, type: QueryTypes.SELECT }) };
}

/** express-session on the migrated `sessions` table: httpOnly, SameSite=Lax, rolling expiry. */
export function sessionMiddleware(config: Config, sequelize: Sequelize): RequestHandler {
  const PgStore = connectPgSimple(expressSession);
  return expressSession({
    store: new PgStore({ pgPromise: sessionQueries(sequelize), tableName: 'sessions', createTableIfMissing: false }),
    name: config.session.cookieName,
    secret: config.session.secret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: config.session.maxAgeMs, path: '/' },
  });
}

/** One app's passport instance. */
export type Passport = InstanceType<typeof passport.Passport>;

/** A passport instance of its own (several apps may share a test process) storing the user id in the session. */
export function createPassport(): Passport {
  const instance = new passport.Passport();
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((id: unknown, done) => {
    const parsed = idSchema.safeParse(id);
    if (!parsed.success) return done(null, false);
    User.findByPk(parsed.data, { include: 'organisation' }).then((user) => done(null, user ?? false), done);
  });
  return instance;
}
