import zlib from 'node:zlib';
import request from 'supertest';
import { Craft } from '@/server/models';
import { patchRow, readDraft, rowOf } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
let ines: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  testApp = await createTestApp();
  ines = await signIn(testApp.app, 'demo-ines', 'sso');
});

afterAll(async () => {
  await testApp.close();
});

/** A request the server cannot read is the client's fault: a 4xx in the one error shape, and the server answers on. */
async function expectRefused(response: request.Response, status: number, code: string) {
  expect(response.status).toBe(status);
  expect(response.body).toEqual({ error: expect.objectContaining({ code, message: expect.any(String) }) });
  expect(JSON.stringify(response.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  await request(testApp.app).get('/api/health').expect(200);
}

describe('requests the server cannot read', () => {
  it('refuses a body in a charset it does not read', async () => {
    const response = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .set('Content-Type', 'application/json; charset=iso-8859-1')
      .send('{"name":"Petrel"}');
    await expectRefused(response, 415, 'unsupported_charset');
  });

  it('refuses a body in an encoding it does not read', async () => {
    const response = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'compress')
      .send('{"name":"Petrel"}');
    await expectRefused(response, 415, 'unsupported_encoding');
  });

  it('refuses a gzip body that does not inflate', async () => {
    const corrupt = zlib.gzipSync(Buffer.from('{"name":"Petrel"}')).subarray(0, 12);
    const response = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send(corrupt);
    await expectRefused(response, 400, 'unreadable_body');
  });

  it('refuses a path with a malformed % escape', async () => {
    await expectRefused(await ines.agent.get('/api/crafts/%E0%A4%A'), 400, 'invalid_path');
  });

  it('refuses a value PostgreSQL cannot store (a NUL in a note) with a 400, and saves nothing of the write', async () => {
    const tern = await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true });
    const amara = await signIn(testApp.app, 'demo-amara', 'sso');
    const draft = await readDraft(amara, tern.id);
    const row = rowOf(draft, 'sail_side');
    const response = await patchRow(amara, draft.path, 'sail_side', { version: row.version, value: 41, note: 'a\u0000b' });
    await expectRefused(response, 400, 'invalid_input');
    const after = rowOf(await readDraft(amara, tern.id), 'sail_side');
    expect({ value: after.value, version: after.version }).toEqual({ value: row.value, version: row.version });
  });

  it('refuses a NUL character in a name, saying where', async () => {
    const response = await ines.agent.post('/api/crafts').set('x-csrf-token', ines.csrfToken).send({ name: 'Pet\u0000rel' });
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body.error)).toContain('name');
  });
});
