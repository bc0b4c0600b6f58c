import { Craft } from '@/server/models';
import { selectRows } from '@/server/models/sheet-rows';
import { toRevisionParameter } from '@/server/services/sheet-store';
import { revisionDetailSchema } from '@/shared/schemas/revisions';
import { readDraft, type Session } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(30_000);

let testApp: TestApp;
let ternId: string;
let amara: Session;
let lucia: Session;

beforeAll(async () => {
  testApp = await createTestApp();
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
  amara = await signIn(testApp.app, 'demo-amara', 'sso');
  lucia = await signIn(testApp.app, 'demo-lucia', 'sso');
});

afterAll(async () => {
  await testApp.close();
});

/** Gives rows of the draft what the seed has none of: text to escape, numbers JSON writes with exponents, absent fields. */
async function storeAwkwardRows(revisionId: string) {
  const update = (key: string, assignments: string, binds: unknown[] = []) =>
    testApp.sequelize.query(`UPDATE revision_parameters SET ${assignments} WHERE revision_id = $1 AND key = $2`, {
      bind: [revisionId, key, ...binds],
    });
  await update('sail_side', 'label = $3, note = $4, source = NULL', ['Side "a" \\ back\u0001slash ü 🚀', 'two\nlines\ttabbed']);
  await update('payload_mass', 'value = 1e21, note = NULL, updated_by_id = NULL');
  await update('boom_count', 'value = 1.5e-7, role = NULL');
  await update('bus_mass', 'value = 0.30000000000000004, protected = true');
}

describe('GET /api/crafts/:craftId/revisions/:revisionId', () => {
  it('gives each row as the write path gives it (toRevisionParameter), in the shared schema', async () => {
    const { path } = await readDraft(amara, ternId);
    const revisionId = path.split('/').pop() ?? '';
    await storeAwkwardRows(revisionId);
    const response = await amara.agent
      .get(path)
      .expect(200)
      .expect('content-type', /application\/json/);

    expect(() => revisionDetailSchema.parse(response.body)).not.toThrow();
    const stored = (await selectRows(testApp.sequelize, revisionId)).map(toRevisionParameter);
    expect(response.body.sheet.parameters).toEqual(stored);
    // Kinds the comparison must have seen: a row by nobody, absent fields, formulas, materials, mass lines, roles.
    const rows = response.body.sheet.parameters as typeof stored;
    expect(rows.find((row) => row.key === 'payload_mass')).toEqual(expect.objectContaining({ value: 1e21, updatedBy: null }));
    expect(rows.find((row) => row.key === 'payload_mass')).not.toHaveProperty('note');
    expect(rows.find((row) => row.key === 'sail_side')?.label).toBe('Side "a" \\ back\u0001slash ü 🚀');
    for (const field of ['formula', 'material', 'mass', 'role', 'source'] as const) {
      expect(rows.some((row) => row[field] !== undefined)).toBe(true);
    }
  });

  it('never gives rows as they were before a change, whatever table the change is in', async () => {
    const { path } = await readDraft(amara, ternId);
    const revisionId = path.split('/').pop() ?? '';
    const changes: [string, string][] = [
      [
        'a value, version and all',
        `UPDATE revision_parameters SET value = 46, version = version + 1 WHERE revision_id = $1 AND key = 'sail_side'`,
      ],
      ['a note, version untouched', `UPDATE revision_parameters SET note = 'Checked' WHERE revision_id = $1 AND key = 'boom_count'`],
      [
        'the order',
        `UPDATE revision_parameters p SET position = o.position FROM revision_parameters o
         WHERE p.revision_id = $1 AND o.revision_id = $1 AND p.key <> o.key AND p.key IN ('sail_side', 'boom_count') AND o.key IN ('sail_side', 'boom_count')`,
      ],
      [
        'a subsystem name',
        `UPDATE subsystems SET name = 'Sail' WHERE id = (SELECT subsystem_id FROM revision_parameters WHERE revision_id = $1 AND key = 'sail_side')`,
      ],
      [
        'a name of who changed a row',
        `UPDATE users SET name = 'A. Osei' WHERE id = (SELECT updated_by_id FROM revision_parameters WHERE revision_id = $1 AND key = 'sail_side')`,
      ],
      ['a row gone', `DELETE FROM revision_parameters WHERE revision_id = $1 AND key = 'bus_mass'`],
    ];
    for (const [what, sql] of changes) {
      await amara.agent.get(path).expect(200);
      await testApp.sequelize.query(sql, { bind: [revisionId] });
      const response = await amara.agent.get(path).expect(200);
      const stored = (await selectRows(testApp.sequelize, revisionId)).map(toRevisionParameter);
      expect({ what, rows: response.body.sheet.parameters }).toEqual({ what, rows: stored });
    }
  });

  it('gives a partner the rows shared with them, as the write path gives them', async () => {
    const { path } = await readDraft(amara, ternId);
    const revisionId = path.split('/').pop() ?? '';
    const response = await lucia.agent.get(path).expect(200);

    const detail = revisionDetailSchema.parse(response.body);
    const shared = new Set(detail.subsystems.map((subsystem) => subsystem.id));
    const stored = (await selectRows(testApp.sequelize, revisionId)).map(toRevisionParameter);
    expect(response.body.sheet.parameters).toEqual(stored.filter((row) => shared.has(row.subsystemId)));
    expect(detail.sheet.parameters.length).toBeGreaterThan(0);
  });

  it("answers another craft's revision with 404, naming the revision", async () => {
    const ines = await signIn(testApp.app, 'demo-ines', 'sso');
    const { path } = await readDraft(amara, ternId);
    const created = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .send({ name: 'Second craft', templateId: 'square-sail' })
      .expect(201);
    const response = await ines.agent.get(path.replace(ternId, String(created.body.id))).expect(404);
    expect(response.body.error).toEqual(expect.objectContaining({ code: 'not_found', message: expect.stringMatching(/Revision/) }));
  });
});
