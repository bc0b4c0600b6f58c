import request from 'supertest';
import { Craft, User } from '@/server/models';
import { demoPeople } from '@/server/seed/demo-scenario';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * Every route × every role, signed out, and a person of another organisation: exactly the designed
 * status, and never another organisation's data. Targets are chosen so that allowed writes do not
 * change what the later rows check.
 */
type Actor = 'signedOut' | 'ines' | 'tomas' | 'amara' | 'kenji' | 'lucia' | 'oren' | 'priya';
const actors: Actor[] = ['signedOut', 'ines', 'tomas', 'amara', 'kenji', 'lucia', 'oren', 'priya'];
const subjectOf = (actor: Exclude<Actor, 'signedOut'>) => `demo-${actor}`;

interface Ids {
  tern: string;
  ines: string;
  tomas: string;
}

interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: (ids: Ids) => string;
  body?: (actor: Actor) => object;
  expected: Partial<Record<Actor, number>> & { default: number };
  /** Ends the session it is called with, so it runs on a session of its own. */
  endsSession?: true;
}

const signedInOnly = { signedOut: 401, default: 200 };
const craftMembersOnly = { signedOut: 401, priya: 404, default: 200 };
const adminsOnly = (allowed: number, otherOrg: number) => ({ signedOut: 401, ines: allowed, priya: otherOrg, default: 403 });

const routes: RouteCase[] = [
  { method: 'get', path: () => '/api/health', expected: { default: 200 } },
  { method: 'get', path: () => '/api/auth/session', expected: { default: 200 } },
  { method: 'get', path: () => '/api/auth/google', expected: { default: 302 } },
  { method: 'get', path: () => '/api/auth/sso', expected: { default: 302 } },
  { method: 'get', path: () => '/api/crafts', expected: signedInOnly },
  { method: 'post', path: () => '/api/crafts', body: (actor) => ({ name: `Matrix craft by ${actor}` }), expected: adminsOnly(201, 201) },
  { method: 'get', path: (ids) => `/api/crafts/${ids.tern}`, expected: craftMembersOnly },
  {
    method: 'patch',
    path: (ids) => `/api/crafts/${ids.tern}`,
    body: () => ({ description: 'Square-sail technology demonstrator on a 12U bus, four diagonal booms.' }),
    expected: { signedOut: 401, ines: 200, tomas: 200, priya: 404, default: 403 },
  },
  { method: 'get', path: (ids) => `/api/crafts/${ids.tern}/members`, expected: craftMembersOnly },
  {
    method: 'put',
    path: (ids) => `/api/crafts/${ids.tern}/members/${ids.ines}`,
    body: () => ({ role: 'viewer' }),
    expected: adminsOnly(200, 404),
  },
  { method: 'delete', path: (ids) => `/api/crafts/${ids.tern}/members/${ids.ines}`, expected: adminsOnly(204, 404) },
  { method: 'get', path: () => '/api/organisation', expected: signedInOnly },
  {
    method: 'post',
    path: () => '/api/organisation/invitations',
    body: (actor) => ({ name: `Invitee of ${actor}`, email: `invitee-${actor.toLowerCase()}@corvid-sailworks.example` }),
    expected: adminsOnly(201, 201),
  },
  {
    method: 'put',
    path: (ids) => `/api/organisation/people/${ids.tomas}/admin`,
    body: () => ({ isOrgAdmin: false }),
    expected: adminsOnly(200, 404),
  },
  { method: 'get', path: () => '/api/no-such-route', expected: { default: 404 } },
  // Last: signing out everywhere also ends the sessions the rows above use.
  { method: 'post', path: () => '/api/auth/sign-out', expected: { default: 204 }, endsSession: true },
  { method: 'post', path: () => '/api/auth/sign-out-everywhere', expected: { signedOut: 401, default: 204 }, endsSession: true },
];

let testApp: TestApp;
let ids: Ids;
type Session = { agent: ReturnType<typeof request.agent>; csrfToken: string };
const sessions = new Map<Actor, Session>();
let corvidSecrets: string[];

async function startSession(actor: Actor): Promise<Session> {
  if (actor !== 'signedOut') return signIn(testApp.app, subjectOf(actor), 'sso');
  const agent = request.agent(testApp.app);
  const session = await agent.get('/api/auth/session').expect(200);
  return { agent, csrfToken: session.body.csrfToken };
}

beforeAll(async () => {
  testApp = await createTestApp();
  const tern = await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true });
  const byEmail = async (subject: string) => {
    const person = demoPeople.find((p) => p.subject === subject);
    return (await User.findOne({ where: { email: person?.email ?? '' }, rejectOnEmpty: true })).id;
  };
  ids = { tern: tern.id, ines: await byEmail('demo-ines'), tomas: await byEmail('demo-tomas') };
  corvidSecrets = [tern.id, 'Tern', 'Corvid', ...demoPeople.filter((p) => p.organisation === 'corvid').map((p) => p.email)];

  for (const actor of actors) sessions.set(actor, await startSession(actor));
});

afterAll(async () => {
  await testApp.close();
});

describe.each(routes)('$method route', (route) => {
  it.each(actors)(`answers %s as designed`, async (actor) => {
    const session = route.endsSession ? await startSession(actor) : sessions.get(actor);
    if (!session) throw new Error(`no session for ${actor}`);
    const path = route.path(ids);
    let call = session.agent[route.method](path).set('x-csrf-token', session.csrfToken);
    if (route.body) call = call.send(route.body(actor));
    const response = await call;
    const expected = route.expected[actor] ?? route.expected.default;
    expect({ route: `${route.method.toUpperCase()} ${path}`, status: response.status }).toEqual({
      route: `${route.method.toUpperCase()} ${path}`,
      status: expected,
    });
    if (response.status >= 400)
      expect(response.body.error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
    if (actor === 'priya') {
      const text = JSON.stringify(response.body);
      for (const secret of corvidSecrets) expect(text).not.toContain(secret);
    }
  });
});
