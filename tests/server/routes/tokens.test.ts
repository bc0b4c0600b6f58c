import crypto from 'node:crypto';
import request from 'supertest';
import { AccessToken, Craft } from '@/server/models';
import { readDraft, rowOf } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(30_000);

let testApp: TestApp;
let amara: Awaited<ReturnType<typeof signIn>>;
let ternId: string;

beforeAll(async () => {
  testApp = await createTestApp();
  amara = await signIn(testApp.app, 'demo-amara', 'sso');
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
});

afterAll(async () => {
  await testApp.close();
});

async function newToken(scope: 'read' | 'read_write', name = `Script ${scope}`) {
  const response = await amara.agent.post('/api/account/tokens').set('x-csrf-token', amara.csrfToken).send({ name, scope }).expect(201);
  return { id: response.body.token.id as string, secret: response.body.secret as string, body: response.body };
}

const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });

describe('personal access tokens', () => {
  it('shows the secret once, stores only its SHA-256 hash, and lists the token without it', async () => {
    const { id, secret, body } = await newToken('read');
    expect(body.token).toEqual(
      expect.objectContaining({
        name: 'Script read',
        scope: 'read',
        prefix: secret.slice(0, body.token.prefix.length),
        lastUsedAt: null,
        revokedAt: null,
      }),
    );
    const stored = await AccessToken.findByPk(id, { rejectOnEmpty: true });
    expect(stored.tokenHash).toBe(crypto.createHash('sha256').update(secret).digest('hex'));
    expect(JSON.stringify(stored.toJSON())).not.toContain(secret);
    const list = await amara.agent.get('/api/account/tokens').expect(200);
    expect(JSON.stringify(list.body)).not.toContain(secret);
    expect(list.body.tokens).toEqual(expect.arrayContaining([expect.objectContaining({ id })]));
  });

  it('reads with a read token, without a session or CSRF token, and notes when it was used', async () => {
    const { id, secret } = await newToken('read');
    const crafts = await request(testApp.app).get('/api/crafts').set(bearer(secret)).expect(200);
    expect(crafts.body.crafts).toEqual([expect.objectContaining({ name: 'Tern' })]);
    expect((await AccessToken.findByPk(id, { rejectOnEmpty: true })).lastUsedAt).not.toBeNull();
  });

  it('refuses a write with a read token (403 token_scope)', async () => {
    const { secret } = await newToken('read');
    const draft = await readDraft(amara, ternId);
    const response = await request(testApp.app)
      .patch(`${draft.path}/parameters/payload_mass`)
      .set(bearer(secret))
      .send({ version: rowOf(draft, 'payload_mass').version, value: 2.5 })
      .expect(403);
    expect(response.body.error.code).toBe('token_scope');
  });

  it('writes with a read-write token and no CSRF token, within the person’s own rights', async () => {
    const { secret } = await newToken('read_write');
    const draft = await readDraft(amara, ternId);
    const response = await request(testApp.app)
      .patch(`${draft.path}/parameters/payload_mass`)
      .set(bearer(secret))
      .send({ version: rowOf(draft, 'payload_mass').version, value: 2.5 })
      .expect(200);
    expect(response.body.value).toBe(2.5);
    await request(testApp.app)
      .patch(`${draft.path}/parameters/speed_of_light`)
      .set(bearer(secret))
      .send({ version: 1, value: 3e8 })
      .expect(403);
  });

  it.each([
    ['get', '/api/account/tokens'],
    ['post', '/api/account/tokens'],
    ['get', '/api/auth/session'],
    ['post', '/api/auth/sign-out-everywhere'],
    ['post', '/api/organisation/invitations'],
    ['put', '/api/crafts/{craftId}/members/{craftId}'],
  ] as const)('never lets a token reach %s %s (403 token_not_allowed)', async (method, path) => {
    const { secret } = await newToken('read_write');
    const response = await request(testApp.app)[method](path.replaceAll('{craftId}', ternId)).set(bearer(secret)).send({});
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('token_not_allowed');
  });

  it('signs a script in for the request only: no session, no cookie, whatever cookie comes along', async () => {
    const { secret } = await newToken('read');
    const draft = await readDraft(amara, ternId);
    const read = await request(testApp.app).get(draft.path).set(bearer(secret)).expect(200);
    expect(read.headers['set-cookie']).toBeUndefined();
    expect(read.body.sheet.parameters.length).toBe(draft.sheet.parameters.length);
    // The person's own browser cookies beside the token change nothing: the token alone signs the request in.
    const withCookies = await amara.agent.get('/api/crafts').set(bearer(secret)).expect(200);
    expect(withCookies.headers['set-cookie']).toBeUndefined();
    await amara.agent.get('/api/auth/session').set(bearer(secret)).expect(403);
  });

  it('refuses a token on the first request after it is revoked, though it was just in use', async () => {
    const { id, secret } = await newToken('read', 'Busy script');
    const draft = await readDraft(amara, ternId);
    await Promise.all(Array.from({ length: 5 }, () => request(testApp.app).get(draft.path).set(bearer(secret)).expect(200)));
    await amara.agent.delete(`/api/account/tokens/${id}`).set('x-csrf-token', amara.csrfToken).expect(204);
    const refused = await request(testApp.app).get(draft.path).set(bearer(secret)).expect(401);
    expect(refused.body.error.code).toBe('invalid_token');
  });

  it('refuses a token revoked through another API process within 5 seconds', async () => {
    const { id, secret } = await newToken('read', 'Revoked elsewhere');
    await request(testApp.app).get('/api/crafts').set(bearer(secret)).expect(200);
    // Another process revokes it: this one hears nothing of it.
    await AccessToken.update({ revokedAt: new Date() }, { where: { id } });
    jest.useFakeTimers({
      doNotFake: ['nextTick', 'setImmediate', 'setTimeout', 'clearTimeout', 'setInterval', 'clearInterval', 'queueMicrotask'],
    });
    try {
      jest.setSystemTime(Date.now() + 5_001);
      const refused = await request(testApp.app).get('/api/crafts').set(bearer(secret)).expect(401);
      expect(refused.body.error.code).toBe('invalid_token');
    } finally {
      jest.useRealTimers();
    }
  });

  it('answers a revoked or unknown token with 401', async () => {
    const { id, secret } = await newToken('read_write', 'Soon revoked');
    await amara.agent.delete(`/api/account/tokens/${id}`).set('x-csrf-token', amara.csrfToken).expect(204);
    const revoked = await request(testApp.app).get('/api/crafts').set(bearer(secret)).expect(401);
    expect(revoked.body.error.code).toBe('invalid_token');
    await request(testApp.app)
      .get('/api/crafts')
      .set(bearer(`${secret}x`))
      .expect(401);
    const list = await amara.agent.get('/api/account/tokens').expect(200);
    expect(list.body.tokens.find((token: { id: string }) => token.id === id).revokedAt).not.toBeNull();
  });
});
