import type { Request } from 'express';
import * as oidc from 'openid-client';
import { Strategy as OidcStrategy, type AuthenticateOptions } from 'openid-client/passport';
import { Strategy as GoogleStrategy } from 'passport-google-oauth20';
import { z } from 'zod';
import type { Config } from '../env';
import { findUserForSignIn, linkIdentityToPerson, type SignInClaims } from '../services/sign-in';
import { describeIssues } from '@/shared/schemas/common';
import type { IdentityLinkResult, SignInErrorCode, SignInProvider } from '@/shared/schemas/session';
import type { Passport } from './session';
import { chosenInvitationOf, identityLinkAt, offerInvitationChoice } from './sign-in-intents';

/** The `info` a strategy passes when it refuses a sign-in it understood. */
export interface SignInRefusal {
  code: SignInErrorCode;
  message: string;
}

/** The `info` a strategy passes when the callback linked (or did not link) a sign-in to the signed-in person. */
export interface IdentityLinkInfo {
  link: IdentityLinkResult;
}

type Done = (error: unknown, user?: Express.User | false, info?: SignInRefusal | IdentityLinkInfo) => void;

const SCOPE = 'openid email profile';

/** The standard OpenID Connect claims a sign-in needs (OpenID Connect Core 1.0 §5.1); an address fits RFC 5321's 254. */
const providerClaimsSchema = z.object({
  sub: z.string().min(1),
  email: z.email().max(254),
  email_verified: z.boolean().default(false),
  name: z.string().default(''),
});

const refusalMessages: Partial<Record<SignInErrorCode, string>> = {
  email_not_verified: 'The provider has not verified this e-mail address',
  identity_not_linked:
    'A person with this e-mail address signs in another way; a new sign-in is linked only by that person or an invitation',
  choose_invitation: 'Several organisations invited this e-mail address; the invitee chooses one',
  invitation_unavailable: 'The chosen invitation was withdrawn or already accepted',
  other_provider: 'The invitation for this e-mail address asks for the other sign-in provider',
  no_account: 'No Trimsheet person or pending invitation for this e-mail address',
};

/** What the provider's claims lead to: a person, a refusal, or (for a signed-in person who asked) a link. */
async function settleClaims(req: Request, provider: SignInProvider, raw: unknown): Promise<Parameters<Done>> {
  const parsed = providerClaimsSchema.safeParse(raw);
  if (!parsed.success) {
    const where = describeIssues(parsed.error.issues);
    const code = parsed.error.issues.some((issue) => issue.path[0] === 'email') ? 'missing_email' : 'provider_error';
    return [null, false, { code, message: `The ${provider} sign-in gave unusable claims (${where})` }];
  }
  const { sub, email, email_verified: emailVerified, name } = parsed.data;
  const claims: SignInClaims = { provider, subject: sub, email, name, emailVerified };
  const link = identityLinkAt(req, provider);
  if (link) {
    const result = link.valid && req.user ? await linkIdentityToPerson(req.user, claims) : 'link_expired';
    return [null, false, { link: result }];
  }
  const outcome = await findUserForSignIn(claims, chosenInvitationOf(req));
  if (outcome.kind === 'person') return [null, outcome.user];
  if (outcome.kind === 'choose') {
    offerInvitationChoice(req, provider, outcome.email, outcome.invitations);
    return [null, false, { code: 'choose_invitation', message: refusalMessages.choose_invitation ?? '' }];
  }
  return [null, false, { code: outcome.code, message: refusalMessages[outcome.code] ?? outcome.code }];
}

function settle(req: Request, provider: SignInProvider, raw: unknown, done: Done) {
  settleClaims(req, provider, raw).then((outcome) => done(...outcome), done);
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
      passReqToCallback: true,
    },
    (req, _accessToken, _refreshToken, profile, done) => settle(req, 'google', profile._json, done),
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
    {
      config: configuration,
      name: 'sso',
      sessionKey: 'sign-in:sso',
      callbackURL: callbackUrl(config, 'sso'),
      scope: SCOPE,
      passReqToCallback: true,
    },
    (req, tokens, done) => settle(req, 'sso', tokens.claims(), done),
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
