import type { Request, RequestHandler, Response } from 'express';
import { unsign } from 'cookie-signature';
import expressSession, { type SessionData } from 'express-session';
import passport from 'passport';
import type { Sequelize } from 'sequelize';
import { idSchema } from '@/shared/schemas/common';
import type { Config } from '../env';
import { Organisation, User } from '../models';
import { preparedQuery } from '../models/prepared-query';
import { signedInUser, signedInUserColumns, type SignedInUserRecord } from './signed-in-user';

declare module 'express-session' {
  interface SessionData {
    /** passport's part: the signed-in person's id. */
    passport?: { user?: unknown };
  }
}

type Lifetimes = Config['session'];

/** A session row as the store read it, with its person (when signed in) read in the same statement. */
interface SessionRecord extends Partial<SignedInUserRecord> {
  sess: SessionData;
  expire: Date;
  endsAt: Date;
}

/** What the store read with a session, kept on the request's session object out of sight of its JSON (a symbol). */
interface ReadWithSession {
  user: SignedInUserRecord | null;
  expireMs: number;
  endsAtMs: number;
}
const readWith = Symbol('read with the session');
type SessionDataRead = SessionData & { [readWith]?: ReadWithSession };

/** The idle expiry of a row is moved forward at most this often, so a busy browser does not rewrite its row per request. */
const TOUCH_RESOLUTION_MS = 60_000;
/**
 * A session found valid is reused this long by the process that read it, so a browser's burst of requests costs
 * one look-up. Ending sessions, and changing or removing people or organisations through the models, takes effect
 * at once in the process that does it (`forget`, `peopleChanged`); done through another API process, within this
 * long: as for access tokens (services/access-tokens.ts).
 */
const RECENT_SESSION_MS = 5_000;
const RECENT_SESSIONS_MAX = 10_000;

/** A session read in the last few seconds: its data as JSON (each request parses its own copy), and what came with it. */
interface RecentSession {
  json: string;
  read: ReadWithSession;
  until: number;
  /** `peopleChanges` when it was read. */
  people: number;
}

/** Counts changes to people and organisations made through the models in this process: a session read before one is read again. */
let peopleChanges = 0;
const peopleChanged = () => {
  peopleChanges += 1;
};

/** Watches the models (initialised on this app's connection) for changes to the people sessions carry; once per model. */
function watchPeople(): void {
  for (const hook of ['afterUpdate', 'afterDestroy', 'afterBulkUpdate', 'afterBulkDestroy'] as const) {
    User.removeHook(hook, 'sessions');
    User.addHook(hook, 'sessions', peopleChanged);
    Organisation.removeHook(hook, 'sessions');
    Organisation.addHook(hook, 'sessions', peopleChanged);
  }
}

const sessionAndPersonSql = `
  SELECT s.sess, s.expire, s.ends_at AS "endsAt", ${signedInUserColumns}
  FROM sessions s
  LEFT JOIN users u ON u.id = CASE WHEN s.sess -> 'passport' ->> 'user' ~ '^[0-9a-f-]{36}$'
                                   THEN (s.sess -> 'passport' ->> 'user')::uuid END
  LEFT JOIN organisations o ON o.id = u.organisation_id
  WHERE s.sid = $1 AND s.expire > now() AND s.ends_at > now()`;

/** Whether moving the idle expiry forward now would move it by less than a minute, or the absolute end caps it already. */
function touchNotDue(read: ReadWithSession, idleMs: number, now: number): boolean {
  return now + idleMs - read.expireMs < TOUCH_RESOLUTION_MS || read.expireMs >= read.endsAtMs;
}

/** Whether a session belongs to someone signed in (passport keeps their id), rather than a sign-in in progress. */
const isSignedIn = (sess: Partial<SessionData>) => typeof sess.passport?.user === 'string';

/**
 * express-session's store on the `sessions` table. Nothing is stored for a visitor until a sign-in starts (the
 * middleware saves only sessions that hold something); a session holding only a sign-in in progress lives
 * `signInMs`. A signed-in one ends after `idleMs` unused and `absoluteMs` after sign-in however much it is used
 * (`ends_at`; signing in gives a new session, so it counts from there). A signed-in request costs at most one
 * statement, the session with its person (see `createPassport` and RECENT_SESSION_MS), and its row is touched at
 * most once a minute.
 */
export class PostgresSessionStore extends expressSession.Store {
  private readonly recent = new Map<string, RecentSession>();
  /** Counts sessions written or ended, so that a read that raced one is not kept. */
  private writes = 0;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly lifetimes: Lifetimes,
  ) {
    super();
    watchPeople();
  }

  private idleMs(sess: Partial<SessionData>): number {
    return isSignedIn(sess) ? this.lifetimes.idleMs : this.lifetimes.signInMs;
  }

  override get(sid: string, callback: (error: unknown, session?: SessionData | null) => void): void {
    const now = Date.now();
    const recent = this.recent.get(sid);
    if (recent && recent.until > now && recent.read.expireMs > now && recent.people === peopleChanges) {
      return callback(null, Object.assign(JSON.parse(recent.json) as SessionData, { [readWith]: recent.read }));
    }
    this.recent.delete(sid);
    const writesBefore = this.writes;
    const peopleBefore = peopleChanges;
    preparedQuery<SessionRecord>(this.sequelize, sessionAndPersonSql, [sid]).then(([record]) => {
      if (!record) return callback(null, null);
      const { sess, expire, endsAt, ...person } = record;
      const read: ReadWithSession = {
        user: person.id ? (person as SignedInUserRecord) : null,
        expireMs: Math.min(expire.getTime(), endsAt.getTime()),
        endsAtMs: endsAt.getTime(),
      };
      if (this.writes === writesBefore) {
        if (this.recent.size >= RECENT_SESSIONS_MAX) this.recent.clear(); // a plain bound: a crowd of browsers starts it over
        this.recent.set(sid, { json: JSON.stringify(sess), read, until: now + RECENT_SESSION_MS, people: peopleBefore });
      }
      callback(null, Object.assign(sess, { [readWith]: read }));
    }, callback);
  }

  /**
   * The person of a signed-in session this process read in the last few seconds and whose row needs no touch
   * yet; undefined otherwise (the request then goes through the session middleware, which reads or touches it).
   */
  recentPerson(sid: string): SignedInUserRecord | undefined {
    const now = Date.now();
    const recent = this.recent.get(sid);
    if (!recent?.read.user || recent.until <= now || recent.read.expireMs <= now || recent.people !== peopleChanges) return undefined;
    return touchNotDue(recent.read, this.lifetimes.idleMs, now) ? recent.read.user : undefined;
  }

  /** express-session's Session copies only enumerable string keys: carry over what was read with the row. */
  override createSession(req: Request, sess: SessionDataRead) {
    const read = sess[readWith];
    const session = super.createSession(req, sess);
    Object.defineProperty(session, readWith, { value: read, enumerable: false });
    return session;
  }

  override set(sid: string, sess: SessionData, callback?: (error?: unknown) => void): void {
    const lifetime = isSignedIn(sess) ? this.lifetimes.absoluteMs : this.lifetimes.signInMs;
    this.sequelize
      .query(
        `INSERT INTO sessions AS s (sid, sess, expire, ends_at)
         VALUES ($1, $2, now() + make_interval(secs => $3), now() + make_interval(secs => $4))
         ON CONFLICT (sid) DO UPDATE SET sess = EXCLUDED.sess, expire = least(EXCLUDED.expire, s.ends_at)`,
        { bind: [sid, JSON.stringify(sess), this.idleMs(sess) / 1000, lifetime / 1000] },
      )
      .then(() => {
        this.forget((recentSid) => recentSid === sid);
        callback?.();
      }, callback);
  }

  /** Moves the idle expiry forward, unless it moved less than a minute ago or the absolute end caps it already. */
  override touch(sid: string, sess: SessionDataRead, callback?: (error?: unknown) => void): void {
    const read = sess[readWith];
    const idleMs = this.idleMs(sess);
    if (read && touchNotDue(read, idleMs, Date.now())) {
      callback?.();
      return;
    }
    preparedQuery<{ expire: Date }>(
      this.sequelize,
      `UPDATE sessions SET expire = least(now() + make_interval(secs => $2), ends_at) WHERE sid = $1 RETURNING expire`,
      [sid, idleMs / 1000],
    ).then(([row]) => {
      // The reads of this session in the last few seconds share this object: they see the new expiry too.
      if (read && row) read.expireMs = row.expire.getTime();
      callback?.();
    }, callback);
  }

  override destroy(sid: string, callback?: (error?: unknown) => void): void {
    this.sequelize.query('DELETE FROM sessions WHERE sid = $1', { bind: [sid] }).then(() => {
      this.forget((recentSid) => recentSid === sid);
      callback?.();
    }, callback);
  }

  /** Deletes every session of the person, and forgets those read in the last few seconds. */
  async endEverySessionOf(userId: string): Promise<void> {
    await this.sequelize.query(`DELETE FROM sessions WHERE sess -> 'passport' ->> 'user' = $1`, { bind: [userId] });
    this.forget((_sid, read) => read.user?.id === userId);
  }

  /** After sessions were written or deleted: drops them from the recent ones, and keeps no read that was under way meanwhile. */
  private forget(written: (sid: string, read: ReadWithSession) => boolean): void {
    this.writes += 1;
    for (const [sid, { read }] of this.recent) if (written(sid, read)) this.recent.delete(sid);
  }
}

/**
 * Ends every session of the signed-in person, this one included (its cookie cleared, as `endSession`), in this
 * process at once and in others within RECENT_SESSION_MS. For sign-out everywhere.
 */
export async function endEverySession(config: Config, req: Request, res: Response, userId: string): Promise<void> {
  await endSession(config, req, res);
  const store: unknown = req.sessionStore;
  if (!(store instanceof PostgresSessionStore)) throw new Error('sessions: the store is not PostgresSessionStore');
  await store.endEverySessionOf(userId);
}

/** The person the store read with this request's session, when it is the one passport names. */
function personReadWith(req: Request, userId: string): SignedInUserRecord | undefined {
  const user = (req.session as SessionDataRead | undefined)?.[readWith]?.user;
  return user?.id === userId ? user : undefined;
}

/** Deletes expired sessions; returns how many. Run now and then (server/index.ts). */
export async function sweepSessions(sequelize: Sequelize): Promise<number> {
  const [, result] = await sequelize.query('DELETE FROM sessions WHERE expire < now()');
  return (result as { rowCount?: number }).rowCount ?? 0;
}

/**
 * express-session on the store: httpOnly, SameSite=Lax, the cookie named `__Host-…` on HTTPS (config) and kept
 * for the absolute lifetime (the row says when the session really ends). Saves only sessions that hold
 * something, so an anonymous visitor costs no row; never re-sends the cookie of an unchanged session.
 */
export function sessionMiddleware(config: Config, store: PostgresSessionStore): RequestHandler {
  return expressSession({
    store,
    name: config.session.cookieName,
    secret: config.session.secret,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: config.session.absoluteMs, path: '/' },
  });
}

/** The session id in a request's signed session cookie (as express-session signs it), or undefined. */
function signedSessionId(cookieHeader: string | undefined, name: string, secret: string): string | undefined {
  for (const pair of cookieHeader?.split(';') ?? []) {
    const separator = pair.indexOf('=');
    if (separator < 0 || pair.slice(0, separator).trim() !== name) continue;
    let value: string;
    try {
      value = decodeURIComponent(pair.slice(separator + 1).trim());
    } catch {
      return undefined;
    }
    if (!value.startsWith('s:')) return undefined;
    const sid = unsign(value.slice(2), secret);
    return sid === false ? undefined : sid;
  }
  return undefined;
}

/**
 * Signs in a read (GET or HEAD) whose session this process read in the last few seconds and whose row needs no
 * touch: the person comes from that read, and the session middleware, passport and the CSRF check are left out
 * (a read changes no session, and CSRF guards only writes). A busy browser's reads then cost no parsing of the
 * session, no hashing of it and no listeners on the answer. Anything else, and every /auth path, goes the whole
 * way: `next('router')` leaves the browser router only for the reads taken here.
 */
export function recentSessionReads(config: Config, store: PostgresSessionStore): RequestHandler {
  return (req, _res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || req.path.startsWith('/auth/')) return next();
    const sid = signedSessionId(req.headers.cookie, config.session.cookieName, config.session.secret);
    const person = sid === undefined ? undefined : store.recentPerson(sid);
    if (!person) return next();
    req.user = signedInUser(person);
    next('router');
  };
}

/** The cookie options the session cookie was set with, which clearing it must repeat (a __Host- cookie needs Secure). */
function sessionCookieOptions(config: Config) {
  return { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' } as const;
}

/**
 * Ends this request's session: its row is deleted and its cookie cleared, and no new session takes its place
 * (the answer carries exactly one Set-Cookie, the clearing one). For sign-out.
 */
export async function endSession(config: Config, req: Request, res: Response): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.destroy((error: unknown) => (error ? reject(error) : resolve())));
  res.clearCookie(config.session.cookieName, sessionCookieOptions(config));
}

/** One app's passport instance. */
export type Passport = InstanceType<typeof passport.Passport>;

/**
 * A passport instance of its own (several apps may share a test process) storing the user id in the session.
 * The person comes from the store's read of the session (one statement for both); a session that was not read
 * from its row in this request (a sign-in that has just saved it) looks the person up.
 */
export function createPassport(): Passport {
  const instance = new passport.Passport();
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((req: Request, id: unknown, done: (error: unknown, user?: Express.User | false) => void) => {
    const parsed = idSchema.safeParse(id);
    if (!parsed.success) return done(null, false);
    const record = personReadWith(req, parsed.data);
    if (record) return done(null, signedInUser(record));
    User.findByPk(parsed.data, { include: 'organisation' }).then((user) => done(null, user ?? false), done);
  });
  return instance;
}
