import { generateKeyPairSync, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type ErrorRequestHandler, type Request, type Response } from 'express';
import { Provider, errors, interactionPolicy, type Configuration, type JWK } from 'oidc-provider';
import { z } from 'zod';
import { demoPeople } from '@/server/seed/demo-scenario';

export interface OidcFakeOptions {
  port: number;
  host?: string;
  /** Public URL of the Trimsheet app, for the clients' redirect URIs. */
  publicUrl: string;
}

export interface OidcFake {
  issuer: string;
  close(): Promise<void>;
}

/** The two relying parties the fake knows: the company SSO client and the stand-in for Google. */
const clients = [
  { id: 'trimsheet-sso', secret: 'trimsheet-sso-secret', provider: 'sso', label: 'Company SSO' },
  { id: 'trimsheet-google', secret: 'trimsheet-google-secret', provider: 'google', label: 'Google' },
] as const;

const STYLE = `
  body { font-family: system-ui, sans-serif; background: #0f1b2d; color: #e8eef7; margin: 0; padding: 2rem 1rem; }
  main { max-width: 34rem; margin: 0 auto; }
  .banner { background: #f2b84b; color: #1d1400; font-weight: 700; padding: .5rem .75rem; border-radius: .4rem; }
  h1 { font-size: 1.4rem; margin: 1.25rem 0 .25rem; }
  p { color: #b8c4d6; }
  form { display: grid; gap: .5rem; margin-top: 1rem; }
  button { text-align: left; font: inherit; color: inherit; background: #1b2c47; border: 1px solid #2f4a73; border-radius: .5rem; padding: .65rem .9rem; cursor: pointer; }
  button:hover, button:focus { border-color: #f2b84b; outline: none; }
  button small { display: block; color: #9fb0c8; }
  button.cancel { text-align: center; background: transparent; }
  label { display: grid; gap: .25rem; color: #b8c4d6; }
  input { font: inherit; padding: .55rem .7rem; border-radius: .4rem; border: 1px solid #2f4a73; background: #0b1524; color: inherit; }
  h2 { font-size: 1.1rem; margin: 1.75rem 0 0; }
`;

/** Anyone else the fake signs in, e.g. to try an invitation: the subject carries their name and e-mail. */
const guestSchema = z.object({
  name: z.string().trim().min(1).max(120),
  email: z.string().trim().toLowerCase().pipe(z.email()),
});
type Guest = z.infer<typeof guestSchema>;
const GUEST_PREFIX = 'guest-';
const guestSubject = (guest: Guest) => GUEST_PREFIX + Buffer.from(JSON.stringify(guest)).toString('base64url');

/** The claims of a demo person or guest subject, or undefined for a subject the fake never issued. */
function claimsOfSubject(subject: string) {
  const person = demoPeople.find((candidate) => candidate.subject === subject);
  if (person) return { sub: subject, email: person.email, email_verified: true, name: person.name };
  if (!subject.startsWith(GUEST_PREFIX)) return undefined;
  try {
    const guest = guestSchema.parse(JSON.parse(Buffer.from(subject.slice(GUEST_PREFIX.length), 'base64url').toString()));
    return { sub: subject, email: guest.email, email_verified: true, name: guest.name };
  } catch {
    return undefined;
  }
}

function escapeHtml(text: string) {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}

function page(title: string, body: string) {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Trimsheet sign-in fake</title><style>${STYLE}</style></head>
<body><main><div class="banner">Trimsheet sign-in fake — development only</div>${body}</main></body></html>`;
}

function errorPage(title: string, message: string) {
  return page(title, `<h1>${escapeHtml(title)}</h1><p>${escapeHtml(message)}</p>`);
}

function loginPage(uid: string, clientId: unknown) {
  const client = clients.find((candidate) => candidate.id === clientId);
  const people = demoPeople
    .map(
      (person) =>
        `<button type="submit" name="subject" value="${escapeHtml(person.subject)}" data-testid="person-${escapeHtml(person.subject)}">` +
        `${escapeHtml(person.name)}<small>${escapeHtml(person.title)} · ${escapeHtml(person.email)}</small></button>`,
    )
    .join('\n');
  return page(
    'Choose a person',
    `<h1>Sign in to Trimsheet${client ? ` with ${escapeHtml(client.label)}` : ''}</h1>
<p>Choose who you are. Every demo person is offered; no password is asked.</p>
<form method="post" action="/interaction/${escapeHtml(uid)}/login">${people}</form>
<h2>Someone else</h2>
<p>To try an invitation: sign in with the name and e-mail address an organisation admin invited.</p>
<form method="post" action="/interaction/${escapeHtml(uid)}/login">
<label>Name <input name="name" required maxlength="120" data-testid="other-name"></label>
<label>E-mail <input name="email" type="email" required data-testid="other-email"></label>
<button type="submit" data-testid="person-other">Sign in as this person</button></form>
<form method="post" action="/interaction/${escapeHtml(uid)}/cancel"><button type="submit" class="cancel" data-testid="cancel">Cancel</button></form>`,
  );
}

function signingKey(): JWK {
  const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  return { ...privateKey.export({ format: 'jwk' }), kid: 'trimsheet-fake', use: 'sig', alg: 'RS256' } as JWK;
}

function providerConfiguration(publicUrl: string): Configuration {
  const policy = interactionPolicy.base();
  // The fake asks which person signs in on every authorization, so switching people never needs a sign-out at the fake.
  policy.get('login')?.checks.add(
    new interactionPolicy.Check('choose_person', 'the fake always asks which demo person signs in', 'login_required', (ctx) =>
      ctx.oidc.result?.login ? interactionPolicy.Check.NO_NEED_TO_PROMPT : interactionPolicy.Check.REQUEST_PROMPT,
    ),
  );
  return {
    clients: clients.map((client) => ({
      client_id: client.id,
      client_secret: client.secret,
      client_name: `Trimsheet (${client.label})`,
      redirect_uris: [`${publicUrl}/api/auth/${client.provider}/callback`],
      grant_types: ['authorization_code'],
      response_types: ['code'],
      // passport-oauth2 sends the client credentials in the body; openid-client is told to do the same.
      token_endpoint_auth_method: 'client_secret_post',
    })),
    async findAccount(_ctx, sub) {
      const claims = claimsOfSubject(sub);
      return claims && { accountId: sub, claims: () => claims };
    },
    claims: { openid: ['sub'], email: ['email', 'email_verified'], profile: ['name'] },
    // With the default, name and e-mail would reach only userinfo; the SSO client reads them from the ID token.
    conformIdTokenClaims: false,
    // passport-google-oauth20 sends the access token to userinfo as a query parameter.
    acceptQueryParamAccessTokens: true,
    // passport-google-oauth20 picks its OpenID profile parser only when the userinfo path ends in /userinfo.
    routes: { userinfo: '/me/userinfo' },
    pkce: { required: () => true },
    ttl: { AuthorizationCode: 60, AccessToken: 600, IdToken: 600, Grant: 600, Interaction: 600, Session: 3600 },
    features: { devInteractions: { enabled: false } },
    interactions: { policy, url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    cookies: { keys: [randomBytes(32).toString('hex')] },
    jwks: { keys: [signingKey()] },
    async renderError(ctx, out) {
      ctx.type = 'html';
      ctx.body = errorPage('Sign-in failed', `${String(out.error)}: ${String(out.error_description ?? '')}`);
    },
  };
}

/** The subject the login form chose: a demo person's, or a guest's from a name and e-mail. */
function chosenSubject(body: unknown): string | undefined {
  const form = (body ?? {}) as Record<string, unknown>;
  if (typeof form.subject === 'string') return demoPeople.some((p) => p.subject === form.subject) ? form.subject : undefined;
  const guest = guestSchema.safeParse(form);
  return guest.success ? guestSubject(guest.data) : undefined;
}

function interactionRoutes(provider: Provider) {
  const router = express.Router();
  // Only the fake's own forms are parsed here: the provider reads its endpoints' bodies itself.
  const form = express.urlencoded({ extended: false, limit: '4kb' });

  // GET /interaction/:uid: the browser of a sign-in in progress; the login page; 400 when the interaction expired.
  router.get('/interaction/:uid', async (req: Request, res: Response) => {
    const interaction = await provider.interactionDetails(req, res);
    res.type('html').send(loginPage(interaction.uid, interaction.params.client_id));
  });

  // POST /interaction/:uid/login: the browser of a sign-in in progress; signs the chosen person in and returns to
  // the client; 400 for an unknown person or an expired interaction.
  router.post('/interaction/:uid/login', form, async (req: Request, res: Response) => {
    const interaction = await provider.interactionDetails(req, res);
    const subject = chosenSubject(req.body);
    if (!subject) {
      res.status(400).type('html').send(errorPage('Unknown person', 'Choose a demo person from the list, or give a name and a valid e-mail address.'));
      return;
    }
    // Forget whoever signed in at the fake before, so choosing someone else is not taken for an account switch.
    if (interaction.session) {
      const previous = await provider.Session.find(interaction.session.cookie);
      await previous?.destroy();
      interaction.session = undefined;
      await interaction.persist();
    }
    const grant = new provider.Grant({ accountId: subject, clientId: String(interaction.params.client_id) });
    if (typeof interaction.params.scope === 'string') grant.addOIDCScope(interaction.params.scope);
    const grantId = await grant.save();
    await provider.interactionFinished(req, res, { login: { accountId: subject }, consent: { grantId } }, { mergeWithLastSubmission: false });
  });

  // POST /interaction/:uid/cancel: the browser of a sign-in in progress; returns access_denied to the client;
  // 400 when the interaction expired.
  router.post('/interaction/:uid/cancel', async (req: Request, res: Response) => {
    await provider.interactionFinished(
      req,
      res,
      { error: 'access_denied', error_description: 'The person cancelled the sign-in' },
      { mergeWithLastSubmission: false },
    );
  });

  const renderFailure: ErrorRequestHandler = (error: unknown, _req, res, _next) => {
    if (error instanceof errors.SessionNotFound) {
      res.status(400).type('html').send(errorPage('Sign-in expired', 'This sign-in has expired or was already used. Start again from Trimsheet.'));
      return;
    }
    console.error('[oidc-fake] interaction failed:', error);
    res.status(500).type('html').send(errorPage('Sign-in failed', 'The fake could not finish this sign-in. Start again from Trimsheet.'));
  };
  router.use(renderFailure);
  return router;
}

/**
 * Starts a real OpenID Connect provider on loopback for development and tests. It serves the SSO client
 * and a stand-in for Google, and its own login page lists the demo people; choosing one signs them in and
 * grants the requested scopes without a consent page.
 */
export async function startOidcFake({ port, host = '127.0.0.1', publicUrl }: OidcFakeOptions): Promise<OidcFake> {
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`startOidcFake: port must be an integer 0–65535, got ${port}`);
  const app = express();
  // The issuer is fixed when the provider is built, so take the port (a free one when 0) first.
  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(port, host, (error?: Error) => (error ? reject(error) : resolve(listening)));
  });
  const { port: boundPort } = server.address() as AddressInfo;
  const issuer = `http://${host}:${boundPort}`;
  const provider = new Provider(issuer, providerConfiguration(publicUrl.replace(/\/+$/, '')));
  app.use(interactionRoutes(provider));
  app.use(provider.callback());
  return {
    issuer,
    close: () =>
      new Promise<void>((resolve, reject) => {
        server.close((error) => (error ? reject(error) : resolve()));
        server.closeAllConnections();
      }),
  };
}

function argument(args: string[], name: string): string | undefined {
  const index = args.indexOf(name);
  return index === -1 ? undefined : args[index + 1];
}

async function main() {
  const args = process.argv.slice(2);
  const port = Number(argument(args, '--port') ?? '8090');
  const publicUrl = argument(args, '--app-url') ?? 'http://127.0.0.1:8080';
  if (!/^https?:\/\//.test(publicUrl)) throw new Error(`--app-url must be an http(s) URL, got "${publicUrl}"`);
  const fake = await startOidcFake({ port, publicUrl });
  console.log(`[oidc-fake] issuer ${fake.issuer}, redirecting to ${publicUrl}`);
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => void fake.close().then(() => process.exit(0)));
}

if (require.main === module) {
  main().catch((error: unknown) => {
    console.error(`[oidc-fake] ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  });
}
