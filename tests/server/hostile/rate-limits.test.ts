import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { countHit, enforceRateLimit, sweepRateLimits } from '@/server/middleware/rate-limit';
import { cookieHeaderOf, locationOf, signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

beforeEach(async () => {
  await testApp.sequelize.query('DELETE FROM rate_limits');
});

afterAll(async () => {
  await testApp.close();
});

const startSignIn = (app: Parameters<typeof request>[0], forwardedFor?: string) => {
  const start = request(app).get('/api/auth/sso');
  return (forwardedFor ? start.set('X-Forwarded-For', forwardedFor) : start).expect(302).then(locationOf);
};

describe('the sign-in limit', () => {
  it('sends the third start within 15 minutes to the sign-in page with too_many_requests, and says when to retry', async () => {
    const app = testApp.appWith((config) => ({ ...config, signInRateLimit: 2 }));
    expect(await startSignIn(app)).toMatch(/^http/);
    expect(await startSignIn(app)).toMatch(/^http/);
    const refused = await request(app).get('/api/auth/google').expect(302);
    expect(locationOf(refused)).toBe('/sign-in?error=too_many_requests');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(14 * 60);
  });

  it('is shared by two API processes on one database', async () => {
    const first = testApp.appWith((config) => ({ ...config, signInRateLimit: 2 }));
    const second = testApp.appWith((config) => ({ ...config, signInRateLimit: 2 }));
    expect(await startSignIn(first)).toMatch(/^http/);
    expect(await startSignIn(second)).toMatch(/^http/);
    expect(await startSignIn(first)).toBe('/sign-in?error=too_many_requests');
    expect(await startSignIn(second)).toBe('/sign-in?error=too_many_requests');
  });

  it('ignores an X-Forwarded-For the client wrote when no proxy is trusted', async () => {
    const app = testApp.appWith((config) => ({ ...config, signInRateLimit: 2, trustProxy: false }));
    expect(await startSignIn(app, '203.0.113.1')).toMatch(/^http/);
    expect(await startSignIn(app, '203.0.113.2')).toMatch(/^http/);
    expect(await startSignIn(app, '203.0.113.3')).toBe('/sign-in?error=too_many_requests');
  });

  it('counts each client apart by the address a trusted proxy forwards', async () => {
    const app = testApp.appWith((config) => ({ ...config, signInRateLimit: 2, trustProxy: ['loopback'] }));
    expect(await startSignIn(app, '203.0.113.1')).toMatch(/^http/);
    expect(await startSignIn(app, '203.0.113.1')).toMatch(/^http/);
    expect(await startSignIn(app, '203.0.113.1')).toBe('/sign-in?error=too_many_requests');
    expect(await startSignIn(app, '203.0.113.2')).toMatch(/^http/);
    const keys = await testApp.sequelize.query<{ key: string }>(`SELECT key FROM rate_limits ORDER BY key`, { type: QueryTypes.SELECT });
    expect(keys.map((row) => row.key)).toEqual(['203.0.113.1', '203.0.113.2']);
  });
});

describe('the limit on changes', () => {
  it('refuses a person past it with 429 rate_limited and Retry-After, across two API processes, and lets reads and others through', async () => {
    const first = testApp.appWith((config) => ({ ...config, writeRateLimit: 2 }));
    const second = testApp.appWith((config) => ({ ...config, writeRateLimit: 2 }));
    const oren = await signIn(first, 'demo-oren', 'sso');
    const ines = await signIn(first, 'demo-ines', 'sso');
    const markRead = (app: typeof first, who: typeof oren) =>
      request(app).post('/api/notifications/read').set('cookie', cookieHeaderOf(who.agent)).set('x-csrf-token', who.csrfToken).send({});
    expect((await markRead(first, oren)).status).toBeLessThan(300);
    expect((await markRead(second, oren)).status).toBeLessThan(300);
    const refused = await markRead(second, oren);
    expect(refused.status).toBe(429);
    expect(refused.body).toEqual({
      error: {
        code: 'rate_limited',
        message: expect.stringMatching(/^Too many changes; try again in \d+ s$/),
        details: expect.any(Object),
      },
    });
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(refused.headers['retry-after'])).toBeLessThanOrEqual(60);
    await request(first).get('/api/notifications').set('cookie', cookieHeaderOf(oren.agent)).expect(200);
    expect((await markRead(first, ines)).status).toBeLessThan(300);
  });

  it('counts nothing for an anonymous request, which is 401 anyway', async () => {
    const app = testApp.appWith((config) => ({ ...config, writeRateLimit: 1 }));
    const agent = request.agent(app);
    const { csrfToken } = (await agent.get('/api/auth/session').expect(200)).body as { csrfToken: string };
    for (let attempt = 0; attempt < 3; attempt += 1) {
      await agent.post('/api/notifications/read').set('x-csrf-token', csrfToken).send({}).expect(401);
    }
    const counters = await testApp.sequelize.query('SELECT key FROM rate_limits', { type: QueryTypes.SELECT });
    expect(counters).toEqual([]);
  });
});

describe('counting in PostgreSQL', () => {
  const rule = { name: 'test_rule', limit: 2, windowMs: 60_000 };

  it('starts a new window once the old one has ended, and the sweep deletes ended windows only', async () => {
    expect(await countHit(testApp.sequelize, rule, 'a')).toEqual(expect.objectContaining({ allowed: true, hits: 1 }));
    await countHit(testApp.sequelize, rule, 'a');
    expect(await countHit(testApp.sequelize, rule, 'a')).toEqual(expect.objectContaining({ allowed: false, hits: 3 }));
    await countHit(testApp.sequelize, rule, 'b');
    await testApp.sequelize.query(`UPDATE rate_limits SET window_ends_at = now() - interval '1 second' WHERE key = 'a'`);
    expect(await countHit(testApp.sequelize, rule, 'a')).toEqual(expect.objectContaining({ allowed: true, hits: 1 }));
    await testApp.sequelize.query(`UPDATE rate_limits SET window_ends_at = now() - interval '1 second' WHERE key = 'a'`);
    expect(await sweepRateLimits(testApp.sequelize)).toBe(1);
    const left = await testApp.sequelize.query<{ key: string }>('SELECT key FROM rate_limits', { type: QueryTypes.SELECT });
    expect(left).toEqual([{ key: 'b' }]);
  });

  it('counts every one of many simultaneous hits (one atomic statement each)', async () => {
    const verdicts = await Promise.all(Array.from({ length: 20 }, () => countHit(testApp.sequelize, { ...rule, limit: 10 }, 'burst')));
    expect(verdicts.map((verdict) => verdict.hits).sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, index) => index + 1));
    expect(verdicts.filter((verdict) => verdict.allowed)).toHaveLength(10);
  });

  it('lets a service refuse with 429 rate_limited naming what was limited', async () => {
    await enforceRateLimit(testApp.sequelize, { ...rule, limit: 1 }, 'organisation-1', 'invitations');
    await expect(enforceRateLimit(testApp.sequelize, { ...rule, limit: 1 }, 'organisation-1', 'invitations')).rejects.toMatchObject({
      status: 429,
      code: 'rate_limited',
      message: expect.stringMatching(/^Too many invitations; try again in \d+ s$/),
    });
  });
});
