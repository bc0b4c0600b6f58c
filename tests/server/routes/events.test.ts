import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { Craft } from '@/server/models';
import { sheetEventSchema, type SheetEvent } from '@/shared/schemas/revisions';
import { readDraft, rowOf, patchRow } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(30_000);

let testApp: TestApp;
let server: http.Server;
let baseUrl: string;
let ternId: string;

beforeAll(async () => {
  testApp = await createTestApp();
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
  server = testApp.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  await testApp.events.ready();
});

afterAll(async () => {
  await testApp.close();
  await new Promise((resolve) => server.close(resolve));
});

/** The session cookie of a signed-in agent, to open the stream as that person with a plain HTTP client. */
function cookieOf(session: Awaited<ReturnType<typeof signIn>>): string {
  const cookies = (session.agent as unknown as { jar: { getCookies(options: object): { toValueString(): string }[] } }).jar.getCookies({
    domain: '127.0.0.1',
    path: '/',
    secure: false,
    script: false,
  });
  return cookies.map((cookie) => cookie.toValueString()).join('; ');
}

/** Opens the craft's event stream as the person and collects its events until closed. */
async function openStream(cookie: string) {
  const events: SheetEvent[] = [];
  const response = await new Promise<http.IncomingMessage>((resolve, reject) => {
    http.get(`${baseUrl}/api/crafts/${ternId}/events`, { headers: { cookie, accept: 'text/event-stream' } }, resolve).on('error', reject);
  });
  let buffer = '';
  response.setEncoding('utf8');
  response.on('data', (chunk: string) => {
    buffer += chunk;
    const blocks = buffer.split('\n\n');
    buffer = blocks.pop() ?? '';
    for (const block of blocks) {
      const data = block.split('\n').find((line) => line.startsWith('data: '));
      if (data) events.push(sheetEventSchema.parse(JSON.parse(data.slice('data: '.length))));
    }
  });
  const next = (within: number) =>
    new Promise<SheetEvent>((resolve, reject) => {
      const started = Date.now();
      const poll = setInterval(() => {
        const event = events.shift();
        if (event) {
          clearInterval(poll);
          resolve(event);
        } else if (Date.now() - started > within) {
          clearInterval(poll);
          reject(new Error(`no event within ${within} ms`));
        }
      }, 10);
    });
  return { response, next, close: () => response.destroy() };
}

describe('GET /api/crafts/:craftId/events', () => {
  it("delivers another person's write within 2 s, as a server-sent event", async () => {
    const oren = await signIn(testApp.app, 'demo-oren', 'sso');
    const amara = await signIn(testApp.app, 'demo-amara', 'sso');
    const stream = await openStream(cookieOf(oren));
    expect(stream.response.statusCode).toBe(200);
    expect(stream.response.headers['content-type']).toMatch(/^text\/event-stream/);
    expect(stream.response.headers['x-accel-buffering']).toBe('no');
    try {
      const draft = await readDraft(amara, ternId);
      await patchRow(amara, draft.path, 'bus_mass', { version: rowOf(draft, 'bus_mass').version, value: 10.25 }).expect(200);
      const event = await stream.next(2000);
      expect(event).toEqual(
        expect.objectContaining({ type: 'parameters_changed', craftId: ternId, revisionId: draft.revision.id, keys: ['bus_mass'] }),
      );
      expect(event.by?.name).toBe('Amara Osei');
    } finally {
      stream.close();
    }
  });

  it('tells a partner of every change but names only the rows shared with them', async () => {
    const lucia = await signIn(testApp.app, 'demo-lucia', 'sso');
    const amara = await signIn(testApp.app, 'demo-amara', 'sso');
    const stream = await openStream(cookieOf(lucia));
    try {
      const draft = await readDraft(amara, ternId);
      await patchRow(amara, draft.path, 'bus_mass', { version: rowOf(draft, 'bus_mass').version, value: 10.5 }).expect(200);
      expect((await stream.next(2000)).keys).toEqual([]);
      await patchRow(amara, draft.path, 'sail_side', { version: rowOf(draft, 'sail_side').version, value: 46 }).expect(200);
      expect((await stream.next(2000)).keys).toEqual(['sail_side']);
    } finally {
      stream.close();
    }
  });

  it('keeps delivering after the listening connection is cut', async () => {
    const oren = await signIn(testApp.app, 'demo-oren', 'sso');
    const amara = await signIn(testApp.app, 'demo-amara', 'sso');
    const stream = await openStream(cookieOf(oren));
    try {
      const [cut] = await testApp.sequelize.query<{ terminated: boolean }>(
        `SELECT pg_terminate_backend(pid) AS terminated FROM pg_stat_activity WHERE datname = current_database() AND query LIKE 'LISTEN%'`,
        { type: QueryTypes.SELECT },
      );
      expect(cut?.terminated).toBe(true);
      // The listener notices the cut, waits a second and listens again.
      await new Promise((resolve) => setTimeout(resolve, 1500));
      await testApp.events.ready();
      const draft = await readDraft(amara, ternId);
      await patchRow(amara, draft.path, 'payload_mass', { version: rowOf(draft, 'payload_mass').version, value: 2.4 }).expect(200);
      expect((await stream.next(2000)).keys).toEqual(['payload_mass']);
    } finally {
      stream.close();
    }
  });

  it('is not found for a person of another organisation', async () => {
    const priya = await signIn(testApp.app, 'demo-priya', 'sso');
    const stream = await openStream(cookieOf(priya));
    expect(stream.response.statusCode).toBe(404);
    stream.close();
  });
});
