import request from 'supertest';
import { MAX_JSON_DEPTH } from '@/server/middleware/body';
import { Craft } from '@/server/models';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
let ines: Awaited<ReturnType<typeof signIn>>;
let tern: Craft;

beforeAll(async () => {
  testApp = await createTestApp();
  ines = await signIn(testApp.app, 'demo-ines', 'sso');
  tern = await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true });
});

afterAll(async () => {
  await testApp.close();
});

const nested = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;

/** An anonymous visitor's agent with the CSRF token the web app would hold (so only sign-in stands in the way). */
async function visitor() {
  const agent = request.agent(testApp.app);
  const { csrfToken } = (await agent.get('/api/auth/session').expect(200)).body as { csrfToken: string };
  return { agent, csrfToken };
}

describe('a body sent without signing in', () => {
  it.each([
    ['not JSON at all', '{"name": '],
    ['nested far too deep', nested(100_000)],
    ['larger than any route takes', JSON.stringify({ name: 'x'.repeat(2_000_000) })],
  ])('is 401 unauthenticated without being read when it is %s', async (_what, body) => {
    const { agent, csrfToken } = await visitor();
    const response = await agent.post('/api/crafts').set('x-csrf-token', csrfToken).set('Content-Type', 'application/json').send(body);
    // Read, it would have been 400 invalid_json, 400 too_deep or 413 too_large.
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });

  it('is not read to its end either: the server hangs up instead of keeping the connection', async () => {
    const { agent, csrfToken } = await visitor();
    const response = await agent
      .post('/api/crafts')
      .set('x-csrf-token', csrfToken)
      .set('Content-Type', 'application/json')
      .send(nested(1_000_000))
      .expect(401);
    expect(response.headers.connection).toBe('close');
  });

  it('is refused for a missing CSRF token before it is read, too', async () => {
    const response = await request(testApp.app).post('/api/crafts').set('Content-Type', 'application/json').send('{"name": ');
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('invalid_csrf_token');
  });
});

describe('a signed-in body', () => {
  const createCraft = (body: string) =>
    ines.agent.post('/api/crafts').set('x-csrf-token', ines.csrfToken).set('Content-Type', 'application/json').send(body);

  it(`is refused with 400 too_deep naming the limit when it nests deeper than ${MAX_JSON_DEPTH} levels`, async () => {
    const prefix = '{"name":"Deep","extra":';
    const response = await createCraft(`${prefix}${nested(MAX_JSON_DEPTH)}}`);
    // The object is the first level: the bracket that goes one too deep is the 32nd.
    const at = prefix.length + MAX_JSON_DEPTH - 1;
    expect(response.status).toBe(400);
    expect(response.body.error).toEqual({
      code: 'too_deep',
      message: `The request body nests deeper than ${MAX_JSON_DEPTH} levels (at byte ${at})`,
      details: { maxDepth: MAX_JSON_DEPTH, at },
    });
  });

  it(`is read at ${MAX_JSON_DEPTH} levels, and brackets inside strings do not count`, async () => {
    const deepest = `{"name":"Deep ${'['.repeat(100)}","extra":${nested(MAX_JSON_DEPTH - 1)}}`;
    const response = await createCraft(deepest);
    // Read (the craft is created; the schema drops the field it does not know).
    expect(response.status).toBe(201);
    expect(response.body.name).toBe(`Deep ${'['.repeat(100)}`);
  });

  it('is held to the size of what the route takes: 64 kB for a token, 1 MB for a sheet row', async () => {
    const name = 'x'.repeat(100_000);
    const token = await ines.agent.post('/api/account/tokens').set('x-csrf-token', ines.csrfToken).send({ name, scope: 'read' });
    expect(token.status).toBe(413);
    expect(token.body.error.code).toBe('too_large');

    const { draftRevisionId: draft } = (await ines.agent.get(`/api/crafts/${tern.id}`).expect(200)).body as { draftRevisionId: string };
    const row = await ines.agent
      .post(`/api/crafts/${tern.id}/revisions/${draft}/parameters`)
      .set('x-csrf-token', ines.csrfToken)
      .send({ parameter: { note: name } });
    // Read (it fits 1 MB) and then refused by the schema (a row without a key), not for its size.
    expect(row.status).toBe(400);
    expect(row.body.error.code).toBe('invalid_input');

    const huge = await ines.agent
      .post(`/api/crafts/${tern.id}/revisions/${draft}/parameters`)
      .set('x-csrf-token', ines.csrfToken)
      .send({ parameter: { note: 'x'.repeat(1_100_000) } });
    expect(huge.status).toBe(413);
  });

  it('of a sign-out is held to 4 kB', async () => {
    const response = await ines.agent
      .post('/api/auth/sign-out')
      .set('x-csrf-token', ines.csrfToken)
      .send({ padding: 'x'.repeat(5000) });
    expect(response.status).toBe(413);
  });
});
