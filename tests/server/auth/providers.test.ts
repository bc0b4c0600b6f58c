import request from 'supertest';
import { demoPeople } from '@/server/seed/demo-scenario';
import { locationOf, signIn, type Provider } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

describe.each<Provider>(['google', 'sso'])('signing in with %s', (provider) => {
  it.each(demoPeople.map((person) => [person.subject, person]))('signs %s in as themselves', async (_subject, person) => {
    const { agent, csrfToken } = await signIn(testApp.app, person.subject, provider);
    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toEqual(expect.objectContaining({ email: person.email, name: person.name, isOrgAdmin: person.isOrgAdmin }));
    expect(session.body.csrfToken).toBe(csrfToken);
  });
});

describe.each<Provider>(['google', 'sso'])('the %s authorization request', (provider) => {
  it('asks for an authorization code with PKCE (S256), a state and the OpenID scopes', async () => {
    const params = new URL(locationOf(await request(testApp.app).get(`/api/auth/${provider}`).expect(302))).searchParams;
    expect(Object.fromEntries(params)).toEqual(
      expect.objectContaining({
        response_type: 'code',
        scope: 'openid email profile',
        code_challenge_method: 'S256',
        code_challenge: expect.stringMatching(/^[\w-]{43}$/),
        state: expect.stringMatching(/.{16,}/),
        redirect_uri: `${testApp.config.publicUrl}/api/auth/${provider}/callback`,
      }),
    );
  });
});

describe('the company SSO authorization request', () => {
  it('also carries a nonce for the ID token', async () => {
    const start = locationOf(await request(testApp.app).get('/api/auth/sso').expect(302));
    expect(new URL(start).searchParams.get('nonce')).toMatch(/.{16,}/);
  });
});
