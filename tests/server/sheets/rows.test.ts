import { QueryTypes } from 'sequelize';
import { evaluateSheet } from '@/shared/engine';
import { Craft } from '@/server/models';
import { insertRows } from '@/server/models/sheet-rows';
import { ensureSubsystems } from '@/server/services/sheet-store';
import { syntheticSheet } from '@/tests/bench/synthetic-sheet';
import { readDraft, rowOf, patchRow, type Session } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(30_000);

let testApp: TestApp;
let ternId: string;
let tomas: Session;
let amara: Session;
let kenji: Session;
let lucia: Session;
let oren: Session;
let ines: Session;

beforeAll(async () => {
  testApp = await createTestApp();
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
  tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
  amara = await signIn(testApp.app, 'demo-amara', 'sso');
  kenji = await signIn(testApp.app, 'demo-kenji', 'sso');
  lucia = await signIn(testApp.app, 'demo-lucia', 'sso');
  oren = await signIn(testApp.app, 'demo-oren', 'sso');
  ines = await signIn(testApp.app, 'demo-ines', 'sso');
});

afterAll(async () => {
  await testApp.close();
});

async function historyOf(key: string) {
  return testApp.sequelize.query<{ action: string; before: { value?: number } | null; after: { value?: number; key?: string } | null }>(
    'SELECT action, before, after FROM parameter_changes WHERE key = $1 ORDER BY changed_at, id',
    { bind: [key], type: QueryTypes.SELECT },
  );
}

describe('the seeded working draft', () => {
  it("holds the template's rows, each at a version, with the demo people's edits", async () => {
    const draft = await readDraft(tomas, ternId);
    expect(draft.revision).toEqual(expect.objectContaining({ kind: 'draft', state: 'open', label: 'Working draft' }));
    expect(draft.sheet.parameters.length).toBeGreaterThan(40);
    expect(rowOf(draft, 'sail_side')).toEqual(
      expect.objectContaining({ value: 45, unit: 'm', version: 2, updatedBy: expect.objectContaining({ name: 'Amara Osei' }) }),
    );
    expect(rowOf(draft, 'boom_linear_density')).toEqual(expect.objectContaining({ value: 15, version: 2 }));
    expect(rowOf(draft, 'deployer_mass').subsystem).toBe('Deployer');
    expect(rowOf(draft, 'mass_allocation').role).toBe('mass_allocation');
    expect(draft.abilities).toEqual(expect.objectContaining({ manageRows: true, manageSubsystems: true, wholeSheet: true }));
    expect(await historyOf('boom_linear_density')).toEqual([
      expect.objectContaining({ action: 'update', before: expect.objectContaining({ value: 20 }) }),
    ]);
  });
});

describe('GET /api/crafts/:craftId/revisions', () => {
  it('lists the working draft, the PDR baseline it continues from and the open study, oldest first, with who created them', async () => {
    const response = await oren.agent.get(`/api/crafts/${ternId}/revisions`).expect(200);
    const [draft, pdr, study] = response.body.revisions;
    expect(response.body.revisions).toHaveLength(3);
    expect(draft).toEqual(
      expect.objectContaining({
        kind: 'draft',
        state: 'open',
        parentId: pdr.id,
        createdBy: expect.objectContaining({ name: 'Tomás Reyes' }),
        lockedAt: null,
      }),
    );
    expect(pdr).toEqual(expect.objectContaining({ kind: 'baseline', state: 'locked', label: 'PDR', parentId: null }));
    expect(study).toEqual(
      expect.objectContaining({
        kind: 'study',
        state: 'open',
        parentId: draft.id,
        createdBy: expect.objectContaining({ name: 'Kenji Hollis' }),
      }),
    );
  });

  it("gives the other organisation's craft a sheet of its own", async () => {
    const priya = await signIn(testApp.app, 'demo-priya', 'sso');
    const skerry = await Craft.findOne({ where: { name: 'Skerry' }, rejectOnEmpty: true });
    const draft = await readDraft(priya, skerry.id);
    expect(rowOf(draft, 'sail_side')).toEqual(expect.objectContaining({ value: 40, version: 1 }));
    const tern = await readDraft(tomas, ternId);
    await priya.agent.get(tern.path).expect(404);
  });
});

describe('PATCH /api/crafts/:craftId/revisions/:revisionId/parameters/:key', () => {
  it('stores a value given with a unit in the row unit, bumps the version and records the change', async () => {
    const draft = await readDraft(amara, ternId);
    const before = rowOf(draft, 'film_thickness');
    const response = await patchRow(amara, draft.path, 'film_thickness', { version: before.version, value: '0.003 mm' }).expect(200);
    expect(response.body).toEqual(expect.objectContaining({ key: 'film_thickness', unit: 'um', version: before.version + 1 }));
    expect(response.body.value).toBeCloseTo(3, 9);
    expect(rowOf(await readDraft(tomas, ternId), 'film_thickness').value).toBeCloseTo(3, 9);
    expect(await historyOf('film_thickness')).toEqual([
      expect.objectContaining({ action: 'update', after: expect.objectContaining({ value: response.body.value }) }),
    ]);
  });

  it('answers a stale version with 409 version_conflict carrying the row as it is now', async () => {
    const draft = await readDraft(amara, ternId);
    const row = rowOf(draft, 'cone_angle');
    await patchRow(amara, draft.path, 'cone_angle', { version: row.version, value: 10 }).expect(200);
    const stale = await patchRow(tomas, draft.path, 'cone_angle', { version: row.version, value: 20 }).expect(409);
    expect(stale.body.error.code).toBe('version_conflict');
    expect(stale.body.error.details.current).toEqual(expect.objectContaining({ key: 'cone_angle', value: 10, version: row.version + 1 }));
  });

  it('applies each of 20 concurrent writers to one row or answers 409, and keeps the last accepted write', async () => {
    const draft = await readDraft(amara, ternId);
    const row = rowOf(draft, 'distance');
    const writers = Array.from({ length: 20 }, (_, index) => ({ session: index % 2 === 0 ? amara : tomas, value: 1.5 + index / 100 }));
    const responses = await Promise.all(
      writers.map((writer) => patchRow(writer.session, draft.path, 'distance', { version: row.version, value: writer.value })),
    );
    const statuses = responses.map((response) => response.status);
    expect(statuses.every((status) => status === 200 || status === 409)).toBe(true);
    const accepted = responses.filter((response) => response.status === 200);
    expect(accepted).toHaveLength(1);
    const final = rowOf(await readDraft(tomas, ternId), 'distance');
    expect(final).toEqual(expect.objectContaining({ value: accepted[0]?.body.value, version: row.version + 1 }));
  });

  it('lets 20 writers reading afresh after each conflict all land, in some order, the last one standing', async () => {
    const draft = await readDraft(amara, ternId);
    const write = async (value: number): Promise<number> => {
      for (;;) {
        const current = rowOf((await amara.agent.get(draft.path).expect(200)).body, 'sail_efficiency');
        const response = await patchRow(amara, draft.path, 'sail_efficiency', { version: current.version, value });
        if (response.status === 200) return response.body.version as number;
        expect(response.status).toBe(409);
      }
    };
    const values = Array.from({ length: 20 }, (_, index) => 0.8 + index / 200);
    const versions = await Promise.all(values.map(write));
    const final = rowOf(await readDraft(tomas, ternId), 'sail_efficiency');
    const last = values[versions.indexOf(Math.max(...versions))];
    expect(new Set(versions).size).toBe(20);
    expect(final.value).toBe(last);
  });

  it('lets two people change different rows from the same read without a conflict', async () => {
    const draft = await readDraft(amara, ternId);
    await Promise.all([
      patchRow(amara, draft.path, 'payload_mass', { version: rowOf(draft, 'payload_mass').version, value: 2.2 }).expect(200),
      patchRow(tomas, draft.path, 'bus_mass', { version: rowOf(draft, 'bus_mass').version, value: 10.5 }).expect(200),
    ]);
  });

  it.each([
    ['an unknown unit', 'sail_side', { unit: 'furlongs_per_fortnight' }, 'unknown_unit', 'body.unit'],
    ['a value in a unit of another dimension', 'sail_side', { value: '3 kg' }, 'dimension_mismatch', 'body.value'],
    ['a value that is not a quantity', 'sail_side', { value: 'forty metres' }, 'invalid_value', 'body.value'],
    ['a formula that does not parse', 'sail_area', { formula: '=sail_side ^^ 2' }, 'syntax_error', 'body.formula'],
    ['a formula naming an unknown key', 'sail_area', { formula: '=sail_sidee^2' }, 'unknown_key', 'body.formula'],
    ['a formula making a cycle', 'sail_side', { formula: '=SQRT(sail_area)' }, 'cycle', 'body.formula'],
    ['a formula of another dimension', 'sail_area', { formula: '=sail_side' }, 'dimension_mismatch', 'body.formula'],
    ['a unit that breaks the rows using the row', 'sail_side', { unit: 'kg', value: '40 kg' }, 'dimension_mismatch', 'body.value'],
  ])('refuses %s with 400 naming the row, and writes nothing', async (_what, key, change, code, path) => {
    const draft = await readDraft(amara, ternId);
    const before = rowOf(draft, key);
    const response = await patchRow(amara, draft.path, key, { version: before.version, ...change }).expect(400);
    expect(response.body.error.code).toBe(code);
    expect(response.body.error.message).toMatch(/^[a-z_]+: /);
    expect(response.body.error.details).toEqual([expect.objectContaining({ path })]);
    expect(rowOf(await readDraft(amara, ternId), key)).toEqual(before);
  });

  it('keeps an input quantity when only its unit changes', async () => {
    const draft = await readDraft(amara, ternId);
    const row = rowOf(draft, 'front_coating_thickness');
    const response = await patchRow(amara, draft.path, 'front_coating_thickness', { version: row.version, unit: 'um' }).expect(200);
    expect(response.body.unit).toBe('um');
    expect(response.body.value).toBeCloseTo(0.1, 12);
  });

  it('refuses a change to a protected row with the reason', async () => {
    const draft = await readDraft(tomas, ternId);
    const response = await patchRow(tomas, draft.path, 'speed_of_light', { version: 1, value: 3e8 }).expect(403);
    expect(response.body.error.code).toBe('protected');
  });
});

describe('roles on rows', () => {
  it('lets a subsystem owner edit the rows of their subsystems', async () => {
    const draft = await readDraft(kenji, ternId);
    expect(draft.abilities.manageRows).toBe(false);
    const row = rowOf(draft, 'boom_count');
    await patchRow(kenji, draft.path, 'boom_count', { version: row.version, note: 'Four booms, one per diagonal.' }).expect(200);
  });

  it("refuses a subsystem owner on another subsystem's row, saying why", async () => {
    const draft = await readDraft(kenji, ternId);
    const response = await patchRow(kenji, draft.path, 'sail_side', { version: rowOf(draft, 'sail_side').version, value: 50 }).expect(403);
    expect(response.body.error).toEqual(
      expect.objectContaining({ code: 'forbidden', message: expect.stringContaining('"Sail membrane"') }),
    );
  });

  it('refuses a subsystem owner a rename, even of their own row', async () => {
    const draft = await readDraft(kenji, ternId);
    const response = await patchRow(kenji, draft.path, 'boom_count', { version: rowOf(draft, 'boom_count').version, key: 'booms' }).expect(
      403,
    );
    expect(response.body.error.message).toMatch(/systems and chief engineers/);
  });

  it('shows a partner only the rows shared with them, with the headline figures', async () => {
    const draft = await readDraft(lucia, ternId);
    const subsystems = new Set(draft.sheet.parameters.map((parameter) => parameter.subsystem));
    expect([...subsystems]).toEqual(['Sail membrane']);
    expect(draft.abilities).toEqual(expect.objectContaining({ wholeSheet: false, manageRows: false, editableSubsystemIds: [] }));
    expect(draft.subsystems.map((subsystem) => subsystem.name)).toEqual(['Sail membrane']);
    expect(draft.headlineFigures?.map((figure) => figure.role)).toEqual(
      expect.arrayContaining(['characteristic_acceleration', 'predicted_mass']),
    );
    expect(draft.headlineFigures?.every((figure) => typeof figure.value === 'number')).toBe(true);
  });

  it("gives a partner their rows' values computed over the whole sheet, and no other row's", async () => {
    const draft = await readDraft(lucia, ternId);
    const whole = await readDraft(amara, ternId);
    const evaluation = evaluateSheet(whole.sheet);
    // A formula row's value comes from the evaluation of the whole sheet, as the systems engineer's does.
    expect(rowOf(draft, 'membrane_mass').formula).toBeDefined();
    expect(draft.serverValues?.membrane_mass).toEqual(evaluation.values.membrane_mass);
    expect(Object.keys(draft.serverValues ?? {}).sort()).toEqual(draft.sheet.parameters.map((parameter) => parameter.key).sort());
    expect(whole.serverValues).toBeUndefined();
  });

  it('refuses a partner every edit, and hides the rows not shared (404)', async () => {
    const draft = await readDraft(lucia, ternId);
    const own = await patchRow(lucia, draft.path, 'sail_side', { version: rowOf(draft, 'sail_side').version, value: 50 }).expect(403);
    expect(own.body.error.message).toMatch(/Partners read/);
    await patchRow(lucia, draft.path, 'bus_mass', { version: 1, value: 50 }).expect(404);
  });

  it('gives a partner only the evaluation of the rows they see', async () => {
    const draft = await readDraft(lucia, ternId);
    const evaluation = await lucia.agent.get(`${draft.path}/evaluation`).expect(200);
    expect(Object.keys(evaluation.body.values).sort()).toEqual(draft.sheet.parameters.map((parameter) => parameter.key).sort());
    expect(evaluation.body.budget.result.rows.map((line: { key: string }) => line.key)).toEqual(['membrane_mass']);
  });

  it.each([
    ['a viewer', () => oren, /Viewers read/],
    ['an organisation admin without a role', () => ines, /Organisation admins read/],
  ])('lets %s read but not edit', async (_who, session, reason) => {
    const draft = await readDraft(session(), ternId);
    expect(draft.abilities).toEqual(expect.objectContaining({ editableSubsystemIds: [], manageRows: false, wholeSheet: true }));
    const response = await patchRow(session(), draft.path, 'bus_mass', { version: rowOf(draft, 'bus_mass').version, value: 11 }).expect(
      403,
    );
    expect(response.body.error.message).toMatch(reason);
  });
});

describe('GET .../evaluation', () => {
  it("equals the browser engine's evaluation of the same sheet", async () => {
    const draft = await readDraft(tomas, ternId);
    const evaluation = await tomas.agent.get(`${draft.path}/evaluation`).expect(200);
    const sheet = {
      name: draft.sheet.name,
      ...(draft.sheet.budget ? { budget: draft.sheet.budget } : {}),
      parameters: draft.sheet.parameters.map(({ subsystemId: _s, version: _v, updatedBy: _u, updatedAt: _a, ...parameter }) => parameter),
    };
    const local = evaluateSheet(sheet);
    expect(evaluation.body.values).toEqual(local.values);
    expect(evaluation.body.errors).toEqual(local.errors);
    expect(evaluation.body.budget.ok).toBe(true);
  });
});

describe('rows: add, rename, reorder, move, delete', () => {
  it('adds a row at the end of its subsystem and refuses a duplicate key', async () => {
    const draft = await readDraft(amara, ternId);
    const parameter = { key: 'harness_mass', label: 'Harness mass', subsystem: 'Spacecraft', unit: 'kg', value: 0.4 };
    const created = await amara.agent.post(`${draft.path}/parameters`).set('x-csrf-token', amara.csrfToken).send({ parameter }).expect(201);
    expect(created.body).toEqual(expect.objectContaining({ ...parameter, version: 1 }));
    const keys = (await readDraft(amara, ternId)).sheet.parameters.map((row) => row.key);
    expect(keys[keys.indexOf('payload_mass') + 1]).toBe('harness_mass');
    const again = await amara.agent.post(`${draft.path}/parameters`).set('x-csrf-token', amara.csrfToken).send({ parameter }).expect(409);
    expect(again.body.error.code).toBe('duplicate_key');
  });

  it('refuses a new row whose formula names an unknown key', async () => {
    const draft = await readDraft(amara, ternId);
    const parameter = { key: 'spare_mass', label: 'Spare', subsystem: 'Spacecraft', unit: 'kg', formula: '=nothing_here * 2' };
    const response = await amara.agent
      .post(`${draft.path}/parameters`)
      .set('x-csrf-token', amara.csrfToken)
      .send({ parameter })
      .expect(400);
    expect(response.body.error.code).toBe('unknown_key');
  });

  it('renames a row and rewrites the formulas that use it, in one change', async () => {
    const draft = await readDraft(amara, ternId);
    const area = rowOf(draft, 'sail_area');
    const boomLength = rowOf(draft, 'boom_length');
    const response = await patchRow(amara, draft.path, 'sail_side', {
      version: rowOf(draft, 'sail_side').version,
      key: 'side_length',
    }).expect(200);
    expect(response.body.key).toBe('side_length');
    const after = await readDraft(amara, ternId);
    expect(rowOf(after, 'sail_area')).toEqual(expect.objectContaining({ formula: '=side_length^2', version: area.version + 1 }));
    expect(rowOf(after, 'boom_length').formula).toBe('=side_length * SQRT(2) / 2');
    expect(rowOf(after, 'boom_length').version).toBe(boomLength.version + 1);
    expect(rowOf(after, 'side_length').role).toBe('sail_side');
    expect(after.sheet.parameters.some((row) => row.key === 'sail_side')).toBe(false);
  });

  it('moves a row before another and to another subsystem', async () => {
    const draft = await readDraft(amara, ternId);
    const row = rowOf(draft, 'harness_mass');
    await patchRow(amara, draft.path, 'harness_mass', { version: row.version, before: 'bus_mass', subsystem: 'Deployer' }).expect(200);
    const keys = (await readDraft(amara, ternId)).sheet.parameters.map((parameter) => parameter.key);
    expect(keys[keys.indexOf('bus_mass') - 1]).toBe('harness_mass');
    expect(rowOf(await readDraft(amara, ternId), 'harness_mass').subsystem).toBe('Deployer');
  });

  it('refuses to delete a row other formulas use, listing them', async () => {
    const draft = await readDraft(amara, ternId);
    const response = await amara.agent
      .delete(`${draft.path}/parameters/sail_area?version=${rowOf(draft, 'sail_area').version}`)
      .set('x-csrf-token', amara.csrfToken)
      .expect(409);
    expect(response.body.error.code).toBe('in_use');
    expect(response.body.error.details.keys).toEqual(expect.arrayContaining(['membrane_mass', 'srp_force', 'areal_density']));
  });

  it('deletes an unused row read at its version, and records it', async () => {
    const draft = await readDraft(amara, ternId);
    const row = rowOf(draft, 'harness_mass');
    await amara.agent
      .delete(`${draft.path}/parameters/harness_mass?version=${row.version + 5}`)
      .set('x-csrf-token', amara.csrfToken)
      .expect(409);
    await amara.agent
      .delete(`${draft.path}/parameters/harness_mass?version=${row.version}`)
      .set('x-csrf-token', amara.csrfToken)
      .expect(204);
    expect((await readDraft(amara, ternId)).sheet.parameters.some((parameter) => parameter.key === 'harness_mass')).toBe(false);
    expect((await historyOf('harness_mass')).map((change) => change.action)).toEqual(['create', 'move', 'delete']);
  });
});

describe('subsystems', () => {
  it('adds, renames and deletes a subsystem; refuses to delete one rows use', async () => {
    const base = `/api/crafts/${ternId}/subsystems`;
    const created = await amara.agent.post(base).set('x-csrf-token', amara.csrfToken).send({ name: 'Thermal control' }).expect(201);
    await amara.agent.post(base).set('x-csrf-token', amara.csrfToken).send({ name: 'Thermal control' }).expect(409);
    const renamed = await amara.agent
      .patch(`${base}/${created.body.id}`)
      .set('x-csrf-token', amara.csrfToken)
      .send({ name: 'ACS' })
      .expect(200);
    expect(renamed.body).toEqual(expect.objectContaining({ id: created.body.id, name: 'ACS' }));
    await kenji.agent.delete(`${base}/${created.body.id}`).set('x-csrf-token', kenji.csrfToken).expect(403);
    await amara.agent.delete(`${base}/${created.body.id}`).set('x-csrf-token', amara.csrfToken).expect(204);

    const draft = await readDraft(amara, ternId);
    const optics = draft.subsystems.find((subsystem) => subsystem.name === 'Optics');
    const refused = await amara.agent
      .delete(`${base}/${String(optics?.id)}`)
      .set('x-csrf-token', amara.csrfToken)
      .expect(409);
    expect(refused.body.error).toEqual(
      expect.objectContaining({ code: 'in_use', details: { keys: expect.arrayContaining(['reflectivity']) } }),
    );
  });
});

describe('POST /api/crafts', () => {
  it('starts a craft from the template with a working draft', async () => {
    const created = await ines.agent.post('/api/crafts').set('x-csrf-token', ines.csrfToken).send({ name: 'Petrel' }).expect(201);
    expect(created.body).toEqual(expect.objectContaining({ templateId: 'square-sail', draftRevisionId: expect.any(String) }));
    const draft = await readDraft(ines, created.body.id);
    expect(rowOf(draft, 'sail_side').value).toBe(40);
    expect(draft.sheet.parameters.every((parameter) => parameter.version === 1)).toBe(true);
  });

  it("copies another craft's current sheet", async () => {
    const created = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .send({ name: 'Tern B', copyOf: ternId })
      .expect(201);
    const copy = await readDraft(ines, created.body.id);
    const original = await readDraft(ines, ternId);
    const strip = (detail: typeof copy) =>
      detail.sheet.parameters.map(({ key, value, formula, subsystem }) => ({ key, value, formula, subsystem }));
    expect(strip(copy)).toEqual(strip(original));
  });

  it('copies a sheet larger than one INSERT statement can carry', async () => {
    // 5,000 rows of 14 bind parameters each are more than PostgreSQL's 65,535 a statement.
    const large = await ines.agent.post('/api/crafts').set('x-csrf-token', ines.csrfToken).send({ name: 'Large' }).expect(201);
    const revisionId = String(large.body.draftRevisionId);
    const synthetic = syntheticSheet(5000).parameters;
    await testApp.sequelize.transaction(async (transaction) => {
      const subsystemIds = await ensureSubsystems(
        testApp.sequelize,
        large.body.id,
        [...new Set(synthetic.map((row) => row.subsystem))],
        transaction,
      );
      const rows = synthetic.map((parameter, index) => ({
        parameter,
        subsystemId: subsystemIds.get(parameter.subsystem) ?? '',
        position: 1000 + index,
      }));
      await insertRows(testApp.sequelize, revisionId, rows, null, transaction);
    });
    const copied = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .send({ name: 'Large copy', copyOf: large.body.id })
      .expect(201);
    const copy = await readDraft(ines, copied.body.id);
    expect(copy.sheet.parameters).toHaveLength((await readDraft(ines, large.body.id)).sheet.parameters.length);
  });

  it('refuses an unknown template and a craft of another organisation', async () => {
    const unknown = await ines.agent
      .post('/api/crafts')
      .set('x-csrf-token', ines.csrfToken)
      .send({ name: 'X', templateId: 'hexagon' })
      .expect(400);
    expect(unknown.body.error.details).toEqual([expect.objectContaining({ path: 'body.templateId' })]);
    const skerry = await Craft.findOne({ where: { name: 'Skerry' }, rejectOnEmpty: true });
    await ines.agent.post('/api/crafts').set('x-csrf-token', ines.csrfToken).send({ name: 'X', copyOf: skerry.id }).expect(404);
  });
});
