import request from 'supertest';
import { cookieHeaderOf, signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * A read whose session this process read moments ago is signed in from that read, without the session
 * middleware (server/auth/session.ts, recentSessionReads). It must answer exactly as the whole way would,
 * and stop the moment the session ends.
 */
let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

/** A read with nothing but the cookie, as a browser's second tab sends it. */
const readCrafts = (cookie: string) => request(testApp.app).get('/api/crafts').set('Cookie', cookie);

describe('reads signed in by a session read moments ago', () => {
  it('answer as the person, the same as the first read, and set no cookie', async () => {
    const amara = await signIn(testApp.app, 'demo-amara', 'sso');
    const cookie = cookieHeaderOf(amara.agent);
    const first = await readCrafts(cookie).expect(200);
    const again = await readCrafts(cookie).expect(200);
    expect(again.body).toEqual(first.body);
    expect(again.headers['set-cookie']).toBeUndefined();
    expect(again.headers['cache-control']).toBe('no-store');
  });

  it('end the moment the person signs out', async () => {
    const tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
    const cookie = cookieHeaderOf(tomas.agent);
    await readCrafts(cookie).expect(200);
    await tomas.agent.post('/api/auth/sign-out').set('x-csrf-token', tomas.csrfToken).expect(204);
    await readCrafts(cookie).expect(401);
  });

  it('end the moment every session of the person is ended from another one', async () => {
    const laptop = await signIn(testApp.app, 'demo-kenji', 'sso');
    const phone = await signIn(testApp.app, 'demo-kenji', 'sso');
    const cookie = cookieHeaderOf(laptop.agent);
    await readCrafts(cookie).expect(200);
    await phone.agent.post('/api/auth/sign-out-everywhere').set('x-csrf-token', phone.csrfToken).expect(204);
    await readCrafts(cookie).expect(401);
  });

  it('refuse a cookie whose signature was tampered with', async () => {
    const lucia = await signIn(testApp.app, 'demo-lucia', 'sso');
    const cookie = cookieHeaderOf(lucia.agent);
    await readCrafts(cookie).expect(200);
    const forged = cookie.replace(/(s%3A[^.;]+\.)([^;])/, (_whole, head: string, first: string) => `${head}${first === 'A' ? 'B' : 'A'}`);
    expect(forged).not.toBe(cookie);
    await readCrafts(forged).expect(401);
  });

  it('leave writes to the whole way: a write without its CSRF token is still refused', async () => {
    const oren = await signIn(testApp.app, 'demo-oren', 'sso');
    const cookie = cookieHeaderOf(oren.agent);
    await readCrafts(cookie).expect(200);
    const response = await request(testApp.app).post('/api/notifications/read').set('Cookie', cookie).send({});
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('invalid_csrf_token');
  });
});
