import type { Request } from 'express';
import * as oidc from 'openid-client';
import { Strategy as OidcStrategy, type AuthenticateOptions } from 'openid-client/passport';
import { Strategy as GoogleStrategy } from 'passport-google-oauth20';
import { z } from 'zod';
import type { Config } from '../env';
import { findUserForSignIn, type SignInProvider } from '../services/sign-in';
import { describeIssues } from '@/shared/schemas/common';
import type { SignInErrorCode } from '@/shared/schemas/session';
import type { Passport } from './session';

/** The `info` a strategy passes when it refuses a sign-in it understood. */
export interface SignInRefusal {
  code: SignInErrorCode;
  message: string;
}

type Done = (error: unknown, user?: Express.User | false, info?: SignInRefusal) => void;

const SCOPE = 'openid email profile';

/** The standard OpenID Connect claims a sign-in needs (OpenID Connect Core 1.0 §5.1). */
const providerClaimsSchema = z.object({
  sub: z.string().min(1),
  email: z.email(),
  email_verified: z.boolean().default(false),
  name: z.string().default(''),
});

async function signInFromClaims(provider: SignInProvider, raw: unknown): Promise<{ user: Express.User } | { refusal: SignInRefusal }> {
  const parsed = providerClaimsSchema.safeParse(raw);
  if (!parsed.success) {
    const where = describeIssues(parsed.error.issues);
    const code = parsed.error.issues.some((issue) => issue.path[0] === 'email') ? 'missing_email' : 'provider_error';
    return { refusal: { code, message: `The ${provider} sign-in gave unusable claims (${where})` } };
  }
  const { sub, email, email_verified: emailVerified, name } = parsed.data;
  const user = await findUserForSignIn({ provider, subject: sub, email, name, emailVerified });
  if (user) return { user };
  if (!emailVerified) return { refusal: { code: 'email_not_verified', message: `The provider has not verified ${email}` } };
  return { refusal: { code: 'no_account', message: `No Trimsheet person or pending invitation for ${email}` } };
}

function settle(provider: SignInProvider, raw: unknown, done: Done) {
  signInFromClaims(provider, raw).then((outcome) => ('user' in outcome ? done(null, outcome.user) : done(null, false, outcome.refusal)), done);
}

const callbackUrl = (config: Config, provider: SignInProvider) => `${config.publicUrl.replace(/\/+$/, '')}/api/auth/${provider}/callback`;

/** Google sign-in (authorization code with PKCE and state) against the configured endpoints. */
export function googleStrategy(config: Config): GoogleStrategy {
  return new GoogleStrategy(
    {
      clientID: config.google.clientId,
      clientSecret: config.google.clientSecret,
      callbackURL: callbackUrl(config, 'google'),
      authorizationURL: config.google.authorizationUrl,
      tokenURL: config.google.tokenUrl,
      userProfileURL: config.google.userInfoUrl,
      scope: SCOPE,
      state: true,
      pkce: true,
    },
    (_accessToken, _refreshToken, profile, done) => settle('google', profile._json, done),
  );
}

/** openid-client's strategy sends PKCE only; this one also sends and checks a state and a nonce. */
class SsoStrategy extends OidcStrategy {
  override authorizationRequestParams<TOptions extends AuthenticateOptions>(req: Request, options: TOptions) {
    const params = new URLSearchParams(super.authorizationRequestParams(req, options));
    params.set('state', oidc.randomState());
    params.set('nonce', oidc.randomNonce());
    return params;
  }
}

async function ssoStrategy(config: Config): Promise<SsoStrategy> {
  const configuration = await oidc.discovery(
    new URL(config.sso.issuer),
    config.sso.clientId,
    config.sso.clientSecret,
    oidc.ClientSecretPost(config.sso.clientSecret),
    { execute: config.sso.allowHttp ? [oidc.allowInsecureRequests] : [], timeout: 5 },
  );
  return new SsoStrategy(
    { config: configuration, name: 'sso', sessionKey: 'sign-in:sso', callbackURL: callbackUrl(config, 'sso'), scope: SCOPE },
    (tokens, done) => settle('sso', tokens.claims(), done),
  );
}

/**
 * Registers the SSO strategy on first use: discovery needs the identity provider, and the server must
 * start while it is down. A failed discovery is retried on the next sign-in.
 */
export function ssoStrategyLoader(passport: Passport, config: Config): () => Promise<void> {
  let ready: Promise<void> | undefined;
  return () => {
    ready ??= ssoStrategy(config).then(
      (strategy) => {
        passport.use(strategy);
      },
      (error: unknown) => {
        ready = undefined;
        throw error;
      },
    );
    return ready;
  };
}
