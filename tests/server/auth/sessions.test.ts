import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { User } from '@/server/models';
import { callbackFromFake, signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

async function sessionRowsOf(email: string) {
  const user = await User.findOne({ where: { email }, rejectOnEmpty: true });
  const rows = await testApp.sequelize.query<{ sid: string }>(`SELECT sid FROM sessions WHERE sess -> 'passport' ->> 'user' = $1`, {
    bind: [user.id],
    type: QueryTypes.SELECT,
  });
  return rows.length;
}

const signedInUser = async (agent: request.Agent) => (await agent.get('/api/auth/session').expect(200)).body.user;

describe('GET /api/auth/session', () => {
  it('answers a visitor with no user, a CSRF token and both providers', async () => {
    const response = await request(testApp.app).get('/api/auth/session').expect(200);
    expect(response.body).toEqual({
      user: null,
      csrfToken: expect.any(String),
      providers: [
        { id: 'google', label: 'Google', startUrl: '/api/auth/google' },
        { id: 'sso', label: 'Company SSO', startUrl: '/api/auth/sso' },
      ],
      invitationChoice: null,
    });
    expect(response.headers['cache-control']).toBe('no-store');
  });
});

describe('the session cookie', () => {
  it('is httpOnly and SameSite=Lax, under its own name', async () => {
    const agent = request.agent(testApp.app);
    const callback = await callbackFromFake(agent, 'demo-amara', 'sso');
    const response = await agent.get(callback).expect(302);
    const cookies: string[] = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
    const sessionCookie = cookies.find((cookie) => cookie.startsWith(`${testApp.config.session.cookieName}=`));
    expect(sessionCookie).toMatch(/; HttpOnly/i);
    expect(sessionCookie).toMatch(/; SameSite=Lax/i);
    expect(sessionCookie).toMatch(/; Path=\//i);
  });
});

describe('CSRF protection', () => {
  it('refuses a POST without the token with 403 invalid_csrf_token', async () => {
    const { agent } = await signIn(testApp.app, 'demo-tomas', 'google');
    const response = await agent.post('/api/auth/sign-out').expect(403);
    expect(response.body.error.code).toBe('invalid_csrf_token');
    expect(await signedInUser(agent)).not.toBeNull();
  });

  it("refuses another session's token", async () => {
    const tomas = await signIn(testApp.app, 'demo-tomas', 'google');
    const amara = await signIn(testApp.app, 'demo-amara', 'google');
    const response = await tomas.agent.post('/api/auth/sign-out').set('x-csrf-token', amara.csrfToken).expect(403);
    expect(response.body.error.code).toBe('invalid_csrf_token');
  });

  it('accepts the token a visitor got before signing in only until the session changes', async () => {
    const agent = request.agent(testApp.app);
    const before = (await agent.get('/api/auth/session').expect(200)).body.csrfToken as string;
    await agent.post('/api/auth/sign-out').set('x-csrf-token', before).expect(204);
    const callback = await callbackFromFake(agent, 'demo-oren', 'sso');
    await agent.get(callback).expect(302);
    const response = await agent.post('/api/auth/sign-out').set('x-csrf-token', before).expect(403);
    expect(response.body.error.code).toBe('invalid_csrf_token');
  });
});

describe('POST /api/auth/sign-out', () => {
  it('ends this session only', async () => {
    const first = await signIn(testApp.app, 'demo-lucia', 'sso');
    const second = await signIn(testApp.app, 'demo-lucia', 'google');
    await first.agent.post('/api/auth/sign-out').set('x-csrf-token', first.csrfToken).expect(204);
    expect(await signedInUser(first.agent)).toBeNull();
    expect(await signedInUser(second.agent)).toEqual(expect.objectContaining({ name: 'Lucia Brandt' }));
  });
});

describe('POST /api/auth/sign-out-everywhere', () => {
  it("ends every session of the person, and nobody else's", async () => {
    const laptop = await signIn(testApp.app, 'demo-kenji', 'sso');
    const tablet = await signIn(testApp.app, 'demo-kenji', 'google');
    const colleague = await signIn(testApp.app, 'demo-ines', 'sso');
    expect(await sessionRowsOf('kenji.hollis@corvid-sailworks.example')).toBe(2);

    await laptop.agent.post('/api/auth/sign-out-everywhere').set('x-csrf-token', laptop.csrfToken).expect(204);

    expect(await signedInUser(laptop.agent)).toBeNull();
    expect(await signedInUser(tablet.agent)).toBeNull();
    expect(await sessionRowsOf('kenji.hollis@corvid-sailworks.example')).toBe(0);
    expect(await signedInUser(colleague.agent)).toEqual(expect.objectContaining({ name: 'Ines Marlowe' }));
  });

  it('asks a visitor to sign in first', async () => {
    const agent = request.agent(testApp.app);
    const { csrfToken } = (await agent.get('/api/auth/session').expect(200)).body;
    const response = await agent.post('/api/auth/sign-out-everywhere').set('x-csrf-token', csrfToken).expect(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });
});
