import { QueryTypes } from 'sequelize';
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

const createCraft = (body: Record<string, unknown>) => ines.agent.post('/api/crafts').set('x-csrf-token', ines.csrfToken).send(body);

async function storedCraft(id: string) {
  const [craft] = await testApp.sequelize.query<{ name: string; description: string }>(
    'SELECT name, description FROM crafts WHERE id = $1',
    {
      bind: [id],
      type: QueryTypes.SELECT,
    },
  );
  return craft;
}

describe('names (single-line text)', () => {
  it('are stored composed (NFC), as the answer says', async () => {
    const response = await createCraft({ name: 'Mouette de Cle\u0301ment' }).expect(201);
    expect(response.body.name).toBe('Mouette de Cl\u00e9ment');
    expect((await storedCraft(response.body.id as string))?.name).toBe('Mouette de Cl\u00e9ment');
  });

  it.each([
    ['only invisible characters', '\u200B\u200D\uFEFF', 'must contain a visible character'],
    ['only filler letters and spaces', '\u3164 \u00A0\u115F', 'must contain a visible character'],
    ['a right-to-left override', 'Tern\u202Egnp.exe', 'must not contain text-direction override characters'],
    ['a direction isolate', 'Tern \u2067v2\u2069', 'must not contain text-direction override characters'],
    ['a line separator', 'Tern\u2028Two', 'must be one line of text, without control characters'],
    ['a line break', 'Tern\nTwo', 'must be one line of text, without control characters'],
    ['a NUL', 'Tern\u0000', 'must be one line of text, without control characters'],
  ])('are refused with 400 naming the field when they hold %s', async (_what, name, message) => {
    const response = await createCraft({ name }).expect(400);
    expect(response.body.error).toEqual(expect.objectContaining({ code: 'invalid_input', details: [{ path: 'body.name', message }] }));
  });
});

describe('descriptions and notes (several lines)', () => {
  it('keep their line breaks and tabs exactly', async () => {
    const description = 'Line one\n\tindented\r\nline three';
    const response = await createCraft({ name: 'Notes kept', description }).expect(201);
    expect(response.body.description).toBe(description);
    expect((await storedCraft(response.body.id as string))?.description).toBe(description);
  });

  it.each([
    ['a NUL, which PostgreSQL cannot store', 'before\u0000after', 'must not contain control characters other than tabs and line breaks'],
    ['a terminal escape', 'red \u001b[31m', 'must not contain control characters other than tabs and line breaks'],
    ['a right-to-left override', 'see \u202Eattached', 'must not contain text-direction override characters'],
  ])('are refused with 400 naming the field when they hold %s, and nothing is stored', async (what, description, message) => {
    const response = await createCraft({ name: `Refused ${what.length}`, description }).expect(400);
    expect(response.body.error.details).toEqual([{ path: 'body.description', message }]);
    const stored = await testApp.sequelize.query(`SELECT name FROM crafts WHERE name LIKE 'Refused %'`, { type: QueryTypes.SELECT });
    expect(stored).toEqual([]);
  });
});
