import type { Request, RequestHandler, Response } from 'express';
import type { Sequelize } from 'sequelize';
import { HttpError } from '../http-error';
import { preparedQuery } from '../models/prepared-query';

/** A limit: at most `limit` hits per key in each window of `windowMs`. Limits of different names count apart. */
export interface RateLimitRule {
  name: string;
  limit: number;
  windowMs: number;
}

/** One hit counted: whether it is within the limit, and when the window ends. */
export interface RateLimitVerdict {
  allowed: boolean;
  hits: number;
  /** Whole seconds until the window ends (at least 1): the Retry-After of a refusal. */
  retryAfterSeconds: number;
}

/**
 * One atomic statement per hit, so every API process on the database counts together: a fixed window that
 * starts at a key's first hit and ends `windowMs` later; a hit after the end starts a new one.
 * (At a window's edge a client may get up to twice the limit in `windowMs`; limits here are for crowds, not
 * for precise quotas.)
 */
const countHitSql = `
  INSERT INTO rate_limits AS r (bucket, key, hits, window_ends_at)
  VALUES ($1, $2, 1, now() + make_interval(secs => $3))
  ON CONFLICT (bucket, key) DO UPDATE SET
    hits = CASE WHEN r.window_ends_at > now() THEN r.hits + 1 ELSE 1 END,
    window_ends_at = CASE WHEN r.window_ends_at > now() THEN r.window_ends_at ELSE EXCLUDED.window_ends_at END
  RETURNING hits, greatest(1, ceil(extract(epoch FROM window_ends_at - now())))::integer AS "retryAfterSeconds"`;

/** Counts one hit of `key` against the rule; the count and the clock are PostgreSQL's. */
export async function countHit(sequelize: Sequelize, rule: RateLimitRule, key: string): Promise<RateLimitVerdict> {
  const [row] = await preparedQuery<{ hits: number; retryAfterSeconds: number }>(sequelize, countHitSql, [
    rule.name,
    key,
    rule.windowMs / 1000,
  ]);
  if (!row) throw new Error(`rate limit ${rule.name}: the counter upsert returned no row`);
  return { allowed: row.hits <= rule.limit, hits: row.hits, retryAfterSeconds: row.retryAfterSeconds };
}

/** 429 rate_limited in the error shape, saying what was limited and when to try again. */
export function rateLimited(what: string, verdict: RateLimitVerdict): HttpError {
  return new HttpError(429, 'rate_limited', `Too many ${what}; try again in ${verdict.retryAfterSeconds} s`, {
    retryAfterSeconds: verdict.retryAfterSeconds,
  });
}

/**
 * For services (invitations per organisation, say): counts a hit of `key` and throws 429 rate_limited once the
 * rule's limit is passed. A route answering through the error middleware gets its Retry-After header there.
 */
export async function enforceRateLimit(sequelize: Sequelize, rule: RateLimitRule, key: string, what: string): Promise<void> {
  const verdict = await countHit(sequelize, rule, key);
  if (!verdict.allowed) throw rateLimited(what, verdict);
}

/**
 * The client's address as this app's `trust proxy` setting gives it: the socket's peer unless a trusted proxy
 * forwarded the request, never an X-Forwarded-For the client wrote itself.
 */
export const byClientAddress = (req: Request): string => req.ip ?? req.socket.remoteAddress ?? 'unknown';

/** The signed-in person (by session or token), or undefined for an anonymous request, which is then not counted. */
export const bySignedInPerson = (req: Request): string | undefined => req.user?.id;

export interface RateLimitOptions extends RateLimitRule {
  /** What is counted, in the plural, for the message: "sign-in attempts", "changes". */
  what: string;
  /** The key to count under; undefined skips counting. Default: the client's address. */
  key?: (req: Request) => string | undefined;
  /** Answers a refused request instead of the 429 (a full-page navigation redirects, say). */
  onLimited?: (req: Request, res: Response, verdict: RateLimitVerdict) => void;
}

/**
 * Middleware counting each request against a rule in PostgreSQL; past the limit: 429 rate_limited with
 * Retry-After (or `onLimited`).
 */
export function rateLimit(sequelize: Sequelize, options: RateLimitOptions): RequestHandler {
  const keyOf = options.key ?? byClientAddress;
  return async (req, res, next) => {
    const key = keyOf(req);
    if (key === undefined) return next();
    const verdict = await countHit(sequelize, options, key);
    if (verdict.allowed) return next();
    res.set('Retry-After', String(verdict.retryAfterSeconds));
    if (options.onLimited) return options.onLimited(req, res, verdict);
    throw rateLimited(options.what, verdict);
  };
}

/** Deletes counters whose window has ended; returns how many. Run now and then (server/index.ts). */
export async function sweepRateLimits(sequelize: Sequelize): Promise<number> {
  const [, result] = await sequelize.query('DELETE FROM rate_limits WHERE window_ends_at < now()');
  return (result as { rowCount?: number }).rowCount ?? 0;
}
