import request from 'supertest';
import { fillTemplate, routeCases, type Ids, type RouteCase } from '../routes/route-cases';
import { routeIds } from '../routes/route-ids';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

/**
 * Hostile requests over every route of route-cases.ts (so every new route is covered the day it is listed
 * there), sent by the chief engineer, who may reach nearly everything: each must be refused with a 4xx in
 * the one error shape, and the server must answer its health check afterwards.
 */
jest.setTimeout(120_000);

interface HostileRequest {
  name: string;
  route: RouteCase;
  path: string;
  /** Raw text sent as the body, with its content type. */
  body?: { text: string; type: string };
}

/** Path parameters an attacker might put where an id belongs. */
const hostileIds = [
  'not-an-id',
  '00000000-0000-0000-0000-00000000000g',
  `${'9'.repeat(300)}`,
  '%2e%2e%2f%2e%2e%2fetc%2fpasswd',
  "1'%20OR%20'1'='1",
];

/** A JSON body nested deeper than any schema goes. */
const deepJson = `${'['.repeat(5000)}${']'.repeat(5000)}`;

/** Every string leaf of a valid body replaced: the same shape with hostile values. */
function replaceStrings(value: unknown, replacement: (text: string) => unknown): unknown {
  if (typeof value === 'string') return replacement(value);
  if (Array.isArray(value)) return value.map((item) => replaceStrings(item, replacement));
  if (value && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([key, item]) => [key, replaceStrings(item, replacement)]));
  }
  return value;
}

/** Whether a body has a string anywhere: only then can its texts be made hostile. */
function hasText(value: unknown): boolean {
  if (typeof value === 'string') return true;
  return value !== null && typeof value === 'object' && Object.values(value).some(hasText);
}

/** Every field of a valid body given the wrong type. */
function wrongTypes(value: unknown): unknown {
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    return Object.fromEntries(Object.keys(value).map((key) => [key, { $gt: '' }]));
  }
  return { $gt: '' };
}

const json = (value: unknown) => ({ text: JSON.stringify(value), type: 'application/json' });

function hostileRequests(route: RouteCase, ids: Ids): HostileRequest[] {
  const path = fillTemplate(route.template, route, ids);
  const requests: HostileRequest[] = [];
  const parameters = [...route.template.matchAll(/\{(\w+)\}/g)].map((match) => match[1] ?? '');
  for (const parameter of parameters) {
    for (const hostile of hostileIds) {
      const filled = fillTemplate(route.template.replace(`{${parameter}}`, hostile), route, ids);
      requests.push({ name: `${parameter} = ${hostile.slice(0, 24)}`, route, path: filled });
    }
  }
  if (route.method !== 'get' && route.method !== 'delete') {
    const valid: unknown = route.body ? JSON.parse(fillTemplate(JSON.stringify(route.body('tomas')), route, ids)) : {};
    requests.push(
      { name: 'malformed JSON', route, path, body: { text: '{"name": "unterminated', type: 'application/json' } },
      { name: 'a JSON array instead of an object', route, path, body: json([valid]) },
      { name: 'JSON nested 5,000 deep', route, path, body: { text: deepJson, type: 'application/json' } },
      { name: 'a JSON string instead of an object', route, path, body: json('DROP TABLE crafts') },
    );
    if (valid && typeof valid === 'object' && Object.keys(valid).length > 0) {
      requests.push({ name: 'every field of the wrong type', route, path, body: json(wrongTypes(valid)) });
    }
    if (hasText(valid)) {
      requests.push(
        { name: 'every text a megabyte long', route, path, body: json(replaceStrings(valid, () => 'x'.repeat(1_100_000))) },
        { name: 'every text 100,000 characters', route, path, body: json(replaceStrings(valid, () => 'x'.repeat(100_000))) },
        { name: 'every text with a NUL byte', route, path, body: json(replaceStrings(valid, (text) => `${text}\u0000`)) },
      );
    }
  }
  return requests;
}

let testApp: TestApp;
let ids: Ids;
let tomas: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  testApp = await createTestApp();
  ids = await routeIds(testApp);
  tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
});

afterAll(async () => {
  await testApp.close();
});

/**
 * Routes that take hostile requests (an id in the path or a body): not the ones that end the session, and
 * not the API's own 404. Ids are not known until the demo is read, so any id stands in while choosing.
 */
const standInIds = new Proxy({} as Ids, { get: () => 'id' });
const targets = routeCases.filter((route) => !route.endsSession && !route.undocumented && hostileRequests(route, standInIds).length > 0);

/** A 4xx with { error: { code, message } }; `what` names the request in a failure. */
function expectRefused(response: request.Response, what: string) {
  expect({ what, clientError: response.status >= 400 && response.status < 500 }).toEqual({ what, clientError: true });
  expect(response.body).toEqual({
    error: expect.objectContaining({ code: expect.stringMatching(/^[a-z_]+$/), message: expect.any(String) }),
  });
}

describe('hostile requests over every route', () => {
  const all = () => targets.flatMap((route) => hostileRequests(route, ids));

  it('covers at least 150 requests', () => {
    expect(all().length).toBeGreaterThanOrEqual(150);
  });

  it.each(
    targets.map((route) => [`${route.method.toUpperCase()} ${route.template}${route.query ? `?${route.query}` : ''}`, route] as const),
  )('%s: each hostile request gets a 4xx in the error shape', async (_name, route) => {
    for (const hostile of hostileRequests(route, ids)) {
      const what = `${route.method.toUpperCase()} ${hostile.path.slice(0, 120)} (${hostile.name})`;
      let call = tomas.agent[route.method](hostile.path).set('x-csrf-token', tomas.csrfToken);
      if (hostile.body) call = call.set('Content-Type', hostile.body.type).send(hostile.body.text);
      if (route.stream) call = call.timeout({ response: 5000 });
      const response = await call;
      expectRefused(response, what);
    }
    await request(testApp.app).get('/api/health').expect(200);
  });
});
