import path from 'node:path';
import { z } from 'zod';
import { describeIssues } from '@/shared/schemas/common';

/** Development-only secrets: refused when NODE_ENV=production. */
const DEV_SECRET = 'trimsheet-development-secret-not-for-production';

/** The development defaults that production must override (they point at the local fakes). */
const envDefaults = {
  OIDC_ISSUER: 'http://127.0.0.1:8090',
  OIDC_CLIENT_SECRET: 'trimsheet-sso-secret',
  GOOGLE_CLIENT_SECRET: 'trimsheet-google-secret',
  GOOGLE_AUTHORIZATION_URL: 'http://127.0.0.1:8090/auth',
  GOOGLE_TOKEN_URL: 'http://127.0.0.1:8090/token',
  GOOGLE_USERINFO_URL: 'http://127.0.0.1:8090/me/userinfo',
};

/** A TCP port number. */
const port = z.coerce.number().int().min(1).max(65535);

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: port.default(8080),
    PUBLIC_URL: z.url().optional(),
    TRUST_PROXY: z
      .string()
      .default('false')
      .refine(
        (value) => value !== 'true',
        'name the proxies (addresses, subnets, loopback) or a hop count; true would trust any X-Forwarded-For',
      ),
    DATABASE_URL: z.string().default('postgres://trimsheet@127.0.0.1:5433/trimsheet'),
    DATABASE_POOL_MAX: z.coerce.number().int().min(1).default(10),
    SESSION_SECRET: z.string().min(16).default(DEV_SECRET),
    SESSION_COOKIE_NAME: z.string().default('trimsheet.sid'),
    SESSION_MAX_AGE_HOURS: z.coerce.number().positive().default(12),
    SESSION_ABSOLUTE_DAYS: z.coerce.number().positive().default(7),
    SIGN_IN_SESSION_MINUTES: z.coerce.number().positive().default(10),
    WEB_DIST: z.string().default(path.resolve(__dirname, '..', 'dist')),
    OIDC_ISSUER: z.url().default(envDefaults.OIDC_ISSUER),
    OIDC_CLIENT_ID: z.string().default('trimsheet-sso'),
    OIDC_CLIENT_SECRET: z.string().default(envDefaults.OIDC_CLIENT_SECRET),
    OIDC_ALLOW_HTTP: z.enum(['true', 'false']).optional(),
    GOOGLE_CLIENT_ID: z.string().default('trimsheet-google'),
    GOOGLE_CLIENT_SECRET: z.string().default(envDefaults.GOOGLE_CLIENT_SECRET),
    GOOGLE_AUTHORIZATION_URL: z.url().default(envDefaults.GOOGLE_AUTHORIZATION_URL),
    GOOGLE_TOKEN_URL: z.url().default(envDefaults.GOOGLE_TOKEN_URL),
    GOOGLE_USERINFO_URL: z.url().default(envDefaults.GOOGLE_USERINFO_URL),
    SMTP_HOST: z.string().default('127.0.0.1'),
    SMTP_PORT: port.default(2525),
    SMTP_SECURE: z.enum(['true', 'false']).default('false'),
    SMTP_IGNORE_TLS: z.enum(['true', 'false']).optional(),
    SMTP_USER: z.string().optional(),
    SMTP_PASS: z.string().optional(),
    MAIL_FROM: z.string().default('Trimsheet <trimsheet@corvid-sailworks.example>'),
    SIGN_IN_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
    WRITE_RATE_LIMIT: z.coerce.number().int().min(1).default(600),
    SERVER_HEADERS_TIMEOUT_SECONDS: z.coerce.number().positive().default(20),
    SERVER_REQUEST_TIMEOUT_SECONDS: z.coerce.number().positive().default(60),
    SERVER_MAX_CONNECTIONS: z.coerce.number().int().min(1).default(2000),
  })
  .superRefine((env, ctx) => {
    if (env.SERVER_HEADERS_TIMEOUT_SECONDS > env.SERVER_REQUEST_TIMEOUT_SECONDS)
      ctx.addIssue({ code: 'custom', path: ['SERVER_HEADERS_TIMEOUT_SECONDS'], message: 'must not exceed SERVER_REQUEST_TIMEOUT_SECONDS' });
    // The server speaks plain HTTP: an https address means a proxy in front, which must be trusted to say so
    // (X-Forwarded-Proto), or Secure cookies are never set and nobody can sign in.
    if (env.PUBLIC_URL?.startsWith('https://') && env.TRUST_PROXY === 'false')
      ctx.addIssue({
        code: 'custom',
        path: ['TRUST_PROXY'],
        message: 'name the TLS-terminating proxy (an address, subnet or loopback) when PUBLIC_URL is https',
      });
    if (env.NODE_ENV !== 'production') return;
    if (env.SESSION_SECRET === DEV_SECRET)
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'set a real SESSION_SECRET in production' });
    // The defaults point at the local sign-in fake; production must name its real providers.
    for (const key of [
      'OIDC_ISSUER',
      'OIDC_CLIENT_SECRET',
      'GOOGLE_CLIENT_SECRET',
      'GOOGLE_AUTHORIZATION_URL',
      'GOOGLE_TOKEN_URL',
      'GOOGLE_USERINFO_URL',
    ] as const) {
      if (env[key] === envDefaults[key])
        ctx.addIssue({ code: 'custom', path: [key], message: `set ${key} for the real identity provider in production` });
    }
  });

/** The parsed configuration; everything else takes it from here instead of reading process.env. */
export type Config = ReturnType<typeof toConfig>;

function toConfig(env: z.infer<typeof envSchema>) {
  const publicUrl = env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`;
  const secureCookies = publicUrl.startsWith('https://');
  const isLoopbackHttp = (url: string) => /^http:\/\/(127\.0\.0\.1|localhost|\[::1\])(:|\/|$)/.test(url);
  return {
    nodeEnv: env.NODE_ENV,
    host: env.HOST,
    port: env.PORT,
    publicUrl,
    secureCookies,
    trustProxy: trustedProxies(env.TRUST_PROXY),
    databaseUrl: env.DATABASE_URL,
    databasePoolMax: env.DATABASE_POOL_MAX,
    session: {
      secret: env.SESSION_SECRET,
      // Browsers accept a __Host- cookie only when it is Secure, host-only and for path /: the prefix goes with HTTPS.
      cookieName: `${secureCookies ? '__Host-' : ''}${env.SESSION_COOKIE_NAME}`,
      /** A signed-in session ends after this long unused… */
      idleMs: env.SESSION_MAX_AGE_HOURS * 3600_000,
      /** …and this long after sign-in, however much it is used. */
      absoluteMs: env.SESSION_ABSOLUTE_DAYS * 86_400_000,
      /** A session holding only a sign-in in progress (the provider's state) ends this long after it starts. */
      signInMs: env.SIGN_IN_SESSION_MINUTES * 60_000,
    },
    webDist: env.WEB_DIST,
    sso: {
      issuer: env.OIDC_ISSUER,
      clientId: env.OIDC_CLIENT_ID,
      clientSecret: env.OIDC_CLIENT_SECRET,
      allowHttp: env.OIDC_ALLOW_HTTP ? env.OIDC_ALLOW_HTTP === 'true' : isLoopbackHttp(env.OIDC_ISSUER),
    },
    google: {
      clientId: env.GOOGLE_CLIENT_ID,
      clientSecret: env.GOOGLE_CLIENT_SECRET,
      authorizationUrl: env.GOOGLE_AUTHORIZATION_URL,
      tokenUrl: env.GOOGLE_TOKEN_URL,
      userInfoUrl: env.GOOGLE_USERINFO_URL,
    },
    smtp: {
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE === 'true',
      ignoreTls: env.SMTP_IGNORE_TLS ? env.SMTP_IGNORE_TLS === 'true' : env.SMTP_HOST === '127.0.0.1',
      user: env.SMTP_USER,
      pass: env.SMTP_PASS,
      from: env.MAIL_FROM,
    },
    signInRateLimit: env.SIGN_IN_RATE_LIMIT,
    /** Changes (any request but GET/HEAD/OPTIONS) per signed-in person per minute. */
    writeRateLimit: env.WRITE_RATE_LIMIT,
    server: {
      headersTimeoutMs: env.SERVER_HEADERS_TIMEOUT_SECONDS * 1000,
      requestTimeoutMs: env.SERVER_REQUEST_TIMEOUT_SECONDS * 1000,
      maxConnections: env.SERVER_MAX_CONNECTIONS,
    },
  };
}

/**
 * Express's `trust proxy` from TRUST_PROXY: `false` (no proxy: the socket's peer is the client), a hop count, or
 * a comma-separated list of proxy addresses, subnets and names (loopback, linklocal, uniquelocal).
 */
function trustedProxies(value: string): boolean | number | string[] {
  if (value === 'false') return false;
  if (/^\d+$/.test(value)) return Number(value);
  return value.split(',').map((part) => part.trim());
}

/** Parses an environment (process.env by default) into the typed configuration, or throws naming each bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  return toConfig(parseEnvironment(envSchema, env));
}

/** Parses an environment with a schema, or throws naming each bad variable. */
function parseEnvironment<S extends z.ZodType>(schema: S, env: NodeJS.ProcessEnv): z.output<S> {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    throw new Error(`Invalid environment: ${describeIssues(parsed.error.issues)}`);
  }
  return parsed.data;
}

const stackEnvSchema = z.object({
  PORT: port.default(8080),
  TRIMSHEET_PG_PORT: port.default(5433),
  TRIMSHEET_OIDC_PORT: port.default(8090),
  TRIMSHEET_SMTP_PORT: port.default(2525),
  TRIMSHEET_INBOX_PORT: port.default(8095),
  TRIMSHEET_TEST_PORT: port.default(8181),
  TRIMSHEET_TEST_PG_PORT: port.default(5434),
  TRIMSHEET_TEST_OIDC_PORT: port.default(8190),
  TRIMSHEET_TEST_SMTP_PORT: port.default(2625),
  TRIMSHEET_TEST_INBOX_PORT: port.default(8195),
  TRIMSHEET_DATA_DIR: z.string().default(path.resolve(__dirname, '..', '.data')),
  TRIMSHEET_SKIP_BUILD: z.enum(['0', '1']).default('0'),
});

/** Settings of the local stack that `npm start` and `npm test` run (ports of the fakes, data folder). */
export type StackConfig = z.infer<typeof stackEnvSchema>;

/** Parses the local stack's settings; used only by server/dev. */
export function loadStackConfig(env: NodeJS.ProcessEnv = process.env): StackConfig {
  return parseEnvironment(stackEnvSchema, env);
}

/** The process environment, for dev tools that pass it on to child processes. */
export function inheritedEnvironment(): NodeJS.ProcessEnv {
  return { ...process.env };
}
