import request from 'supertest';
import { loadConfig } from '@/server/env';
import { Craft } from '@/server/models';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

/** The app as deployed behind a TLS-terminating proxy on this host: an https public address, the proxy trusted. */
const overHttps = () =>
  testApp.appWith((config) => ({
    ...loadConfig({ ...process.env, PUBLIC_URL: 'https://trimsheet.example', TRUST_PROXY: 'loopback' }),
    databaseUrl: config.databaseUrl,
  }));

const setCookies = (response: request.Response): string[] => ([] as string[]).concat(response.headers['set-cookie'] ?? []);

describe('over plain HTTP', () => {
  it('sends no Strict-Transport-Security, and a Permissions-Policy on pages and API alike', async () => {
    for (const path of ['/', '/api/health']) {
      const response = await request(testApp.app).get(path);
      expect(response.headers['strict-transport-security']).toBeUndefined();
      expect(response.headers['permissions-policy']).toMatch(/camera=\(\)/);
      expect(response.headers['permissions-policy']).toMatch(/geolocation=\(\)/);
      expect(response.headers['permissions-policy']).toMatch(/microphone=\(\)/);
    }
  });
});

describe('over HTTPS', () => {
  it('sends Strict-Transport-Security', async () => {
    const response = await request(overHttps()).get('/api/health').set('X-Forwarded-Proto', 'https').expect(200);
    expect(response.headers['strict-transport-security']).toBe('max-age=31536000');
  });

  it('names the session cookie __Host-…: Secure, path /, no domain', async () => {
    const response = await request(overHttps()).get('/api/auth/sso').set('X-Forwarded-Proto', 'https').expect(302);
    const [session, ...others] = setCookies(response).filter((cookie) => cookie.startsWith('__Host-trimsheet.sid='));
    expect(others).toEqual([]);
    expect(session).toMatch(/; Secure/i);
    expect(session).toMatch(/; Path=\/(;|$)/i);
    expect(session).not.toMatch(/; Domain=/i);
  });
});

describe('personal data', () => {
  it('is never cached: every signed-in API answer, downloads included, says Cache-Control: no-store and has no ETag', async () => {
    const ines = await signIn(testApp.app, 'demo-ines', 'sso');
    const tern = await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true });
    for (const path of [
      '/api/auth/session',
      '/api/crafts',
      `/api/crafts/${tern.id}`,
      '/api/account/tokens',
      '/api/notifications',
      '/api/organisation/members',
      `/api/crafts/${tern.id}/audit?format=csv`,
      '/api/crafts/not-an-id',
    ]) {
      const response = await ines.agent.get(path);
      expect({ path, cacheControl: response.headers['cache-control'], etag: response.headers.etag }).toEqual({
        path,
        cacheControl: 'no-store',
        etag: undefined,
      });
    }
  });
});

describe('POST /api/auth/sign-out', () => {
  it('answers with exactly one Set-Cookie: the session cookie, cleared', async () => {
    const ines = await signIn(testApp.app, 'demo-ines', 'sso');
    const response = await ines.agent.post('/api/auth/sign-out').set('x-csrf-token', ines.csrfToken).expect(204);
    const cookies = setCookies(response);
    expect(cookies).toHaveLength(1);
    expect(cookies[0]).toMatch(/^trimsheet\.sid=;/);
    expect(cookies[0]).toMatch(/Expires=Thu, 01 Jan 1970/i);
  });

  it('clears the __Host- cookie with the attributes it was set with over HTTPS', async () => {
    const app = overHttps();
    const session = await request(app).get('/api/auth/session').set('X-Forwarded-Proto', 'https').expect(200);
    const response = await request(app)
      .post('/api/auth/sign-out')
      .set('X-Forwarded-Proto', 'https')
      .set(
        'cookie',
        setCookies(session)
          .map((line) => line.split(';')[0])
          .join('; '),
      )
      .set('x-csrf-token', (session.body as { csrfToken: string }).csrfToken)
      .expect(204);
    const cookies = setCookies(response);
    expect(cookies).toHaveLength(1);
    expect(cookies[0]).toMatch(/^__Host-trimsheet\.sid=;.*; Secure/i);
  });
});
