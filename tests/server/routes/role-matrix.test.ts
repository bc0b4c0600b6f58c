import type { IncomingMessage } from 'node:http';
import request from 'supertest';
import { demoPeople } from '@/server/seed/demo-scenario';
import { actors, fillTemplate, routeCases, type Actor, type Ids } from './route-cases';
import { routeIds } from './route-ids';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * Every route × every role, signed out, and a person of another organisation: exactly the designed
 * status, and never another organisation's data. The routes and statuses are in route-cases.ts.
 */
const subjectOf = (actor: Exclude<Actor, 'signedOut'>) => `demo-${actor}`;

jest.setTimeout(30_000);

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
  ids = await routeIds(testApp);
  corvidSecrets = [ids.craftId, 'Tern', 'Corvid', ...demoPeople.filter((p) => p.organisation === 'corvid').map((p) => p.email)];

  for (const actor of actors) sessions.set(actor, await startSession(actor));
});

afterAll(async () => {
  await testApp.close();
});

/** Reads a streamed answer's status and first chunk, then hangs up; other answers are parsed as JSON. */
function hangUpOnStreams(response: IncomingMessage, done: (error: Error | null, body: unknown) => void) {
  let text = '';
  response.setEncoding('utf8');
  response.on('data', (chunk: string) => {
    text += chunk;
    if (String(response.headers['content-type']).startsWith('text/event-stream')) {
      response.destroy();
      done(null, {});
    }
  });
  response.on('end', () => done(null, text ? JSON.parse(text) : {}));
}

describe.each(routeCases)('$method $template', (route) => {
  it.each(actors)(`answers %s as designed`, async (actor) => {
    const session = route.endsSession ? await startSession(actor) : sessions.get(actor);
    if (!session) throw new Error(`no session for ${actor}`);
    const path = fillTemplate(route.template, route, ids) + (route.query ? `?${fillTemplate(route.query, route, ids)}` : '');
    let call = session.agent[route.method](path).set('x-csrf-token', session.csrfToken);
    if (route.body) call = call.send(JSON.parse(fillTemplate(JSON.stringify(route.body(actor)), route, ids)));
    if (route.stream) call = call.buffer(true).parse(hangUpOnStreams as unknown as Parameters<typeof call.parse>[0]);
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
