import { startOidcFake, type OidcFake } from '@/server/dev/oidc-fake';
import { demoPeople } from '@/server/seed/demo-scenario';
import { chooseAtFake, CookieJar } from '../helpers/sign-in';

let fake: OidcFake;
const appUrl = 'http://127.0.0.1:8999';

beforeAll(async () => {
  fake = await startOidcFake({ port: 0, publicUrl: appUrl });
});

afterAll(async () => {
  await fake.close();
});

// RFC 7636 Appendix B: this code verifier has the S256 code challenge E9Melhoa2OwvFrEMTJguCHaoeK1t8URWbuGJSstw-cM.
const codeVerifier = 'dBjftJeZ4CVP-mB92K27uhbUJU1p1r_wW1gFWFOEjXk';
const callbackPath = '/api/auth/sso/callback';

function authorizationUrl() {
  const authorize = new URL('/auth', fake.issuer);
  authorize.search = new URLSearchParams({
    client_id: 'trimsheet-sso',
    response_type: 'code',
    scope: 'openid email profile',
    redirect_uri: `${appUrl}${callbackPath}`,
    code_challenge: 'E9Melhoa2OwvFrEMTJguCHaoeK1t8URWbuGJSstw-cM',
    code_challenge_method: 'S256',
  }).toString();
  return authorize.href;
}

/** Redeems an authorization code at the token endpoint and returns the ID token's claims. */
async function idTokenClaims(code: string): Promise<Record<string, unknown>> {
  const response = await fetch(`${fake.issuer}/token`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({
      grant_type: 'authorization_code',
      code,
      redirect_uri: `${appUrl}${callbackPath}`,
      code_verifier: codeVerifier,
      client_id: 'trimsheet-sso',
      client_secret: 'trimsheet-sso-secret',
    }).toString(),
  });
  const { id_token: idToken } = (await response.json()) as { id_token: string };
  const [, payload = ''] = idToken.split('.');
  return JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as Record<string, unknown>;
}

/** Starts an authorization at the fake and returns its login page's address and the fake's cookies. */
async function openLoginPage() {
  const response = await fetch(authorizationUrl(), { redirect: 'manual' });
  const cookie = response.headers
    .getSetCookie()
    .map((line) => line.split(';')[0])
    .join('; ');
  return { url: new URL(response.headers.get('location') ?? '', fake.issuer), cookie };
}

describe('the sign-in fake', () => {
  it('publishes discovery with the userinfo path the Google strategy needs', async () => {
    const discovery = await (await fetch(`${fake.issuer}/.well-known/openid-configuration`)).json();
    expect(discovery).toEqual(
      expect.objectContaining({
        issuer: fake.issuer,
        authorization_endpoint: `${fake.issuer}/auth`,
        token_endpoint: `${fake.issuer}/token`,
        userinfo_endpoint: `${fake.issuer}/me/userinfo`,
      }),
    );
  });

  it('shows its own login page, labelled development only, offering every demo person', async () => {
    const { url, cookie } = await openLoginPage();
    const page = await fetch(url, { headers: { cookie } });
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(html).toContain('Trimsheet sign-in fake — development only');
    for (const person of demoPeople) {
      expect(html).toContain(`data-testid="person-${person.subject}"`);
      expect(html).toContain(person.email);
    }
  });

  it('puts e-mail and name into the ID token, and asks again who signs in when the same browser returns', async () => {
    const jar = new CookieJar();
    const first = await chooseAtFake(jar, authorizationUrl(), 'demo-ines', callbackPath);
    expect(await idTokenClaims(first.searchParams.get('code') ?? '')).toEqual(
      expect.objectContaining({ sub: 'demo-ines', email: 'ines.marlowe@corvid-sailworks.example', email_verified: true, name: 'Ines Marlowe' }),
    );
    const second = await chooseAtFake(jar, authorizationUrl(), 'demo-priya', callbackPath);
    expect(await idTokenClaims(second.searchParams.get('code') ?? '')).toEqual(expect.objectContaining({ sub: 'demo-priya' }));
  });

  it('answers an unknown person with a clean 400 page', async () => {
    const { url, cookie } = await openLoginPage();
    const response = await fetch(`${url.href}/login`, {
      method: 'POST',
      redirect: 'manual',
      headers: { cookie, 'content-type': 'application/x-www-form-urlencoded' },
      body: 'subject=demo-nobody',
    });
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('Choose a demo person from the list');
  });

  it('answers someone else without a valid e-mail address with a clean 400 page', async () => {
    const { url, cookie } = await openLoginPage();
    const response = await fetch(`${url.href}/login`, {
      method: 'POST',
      redirect: 'manual',
      headers: { cookie, 'content-type': 'application/x-www-form-urlencoded' },
      body: 'name=Nadia&email=not-an-address',
    });
    expect(response.status).toBe(400);
  });

  it('answers an expired or unknown sign-in with a clean 400 page', async () => {
    const response = await fetch(`${fake.issuer}/interaction/no-such-interaction`);
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('Sign-in expired');
  });

  it('refuses a redirect address that is not registered, on its own error page', async () => {
    const response = await fetch(`${fake.issuer}/auth?client_id=trimsheet-sso&response_type=code&scope=openid&redirect_uri=${encodeURIComponent('http://evil.example/cb')}`);
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('Trimsheet sign-in fake — development only');
  });
});
