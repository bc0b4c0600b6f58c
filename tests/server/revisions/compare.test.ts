import { QueryTypes } from 'sequelize';
import { Craft } from '@/server/models';
import { compareResponseSchema, type CompareResponse, type OutputChange } from '@/shared/schemas/compare';
import { copyAsBaseline } from '../helpers/copy-revision';
import { patchRow, readDraft, rowOf, type Session } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

// Every expected number in this file is worked out by hand from Tern's seeded sheet and the edits made here.

jest.setTimeout(30_000);

let testApp: TestApp;
let ternId: string;
let draftId: string;
/** A locked copy of Tern's draft taken before the edits below: the `from` side. */
let copyId: string;
let amara: Session;
let lucia: Session;

function compare(session: Session, query: string) {
  return session.agent.get(`/api/crafts/${ternId}/compare?${query}`);
}

async function compared(session: Session, query: string): Promise<CompareResponse> {
  const response = await compare(session, query).expect(200);
  return compareResponseSchema.parse(response.body);
}

function outputOf(response: CompareResponse, key: string): OutputChange | undefined {
  return response.outputs.find((output) => output.key === key);
}

beforeAll(async () => {
  testApp = await createTestApp();
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
  amara = await signIn(testApp.app, 'demo-amara', 'sso');
  lucia = await signIn(testApp.app, 'demo-lucia', 'sso');
  const draft = await readDraft(amara, ternId);
  draftId = draft.revision.id;
  copyId = await copyAsBaseline(testApp.sequelize, draftId, 'Compare test baseline');
  // The draft moves on: a 50 m sail (Sail membrane, shared with Lucia) and a lighter boom (Booms, not shared with her).
  await patchRow(amara, draft.path, 'sail_side', { version: rowOf(draft, 'sail_side').version, value: 50 }).expect(200);
  await patchRow(amara, draft.path, 'boom_linear_density', { version: rowOf(draft, 'boom_linear_density').version, value: 12 }).expect(200);
});

afterAll(async () => {
  await testApp.close();
});

describe('GET /api/crafts/:craftId/compare', () => {
  it('lists the changed rows with old and new values in their units', async () => {
    const response = await compared(amara, `from=${copyId}&to=${draftId}`);
    expect(response.from).toEqual(
      expect.objectContaining({ id: copyId, kind: 'baseline', state: 'locked', label: 'Compare test baseline' }),
    );
    expect(response.to).toEqual(expect.objectContaining({ id: draftId, kind: 'draft' }));
    expect(response.rows.added).toEqual([]);
    expect(response.rows.removed).toEqual([]);
    expect(response.rows.changed.map((row) => [row.key, row.changes])).toEqual([
      ['sail_side', [{ field: 'value', from: 45, fromUnit: 'm', to: 50, toUnit: 'm' }]],
      ['boom_linear_density', [{ field: 'value', from: 15, fromUnit: 'g/m', to: 12, toUnit: 'g/m' }]],
    ]);
  });

  it('gives every output old and new: sail_area 2025 m^2 -> 2500 m^2, +475 m^2, +23.457 %', async () => {
    const response = await compared(amara, `from=${copyId}&to=${draftId}`);
    // 45^2 = 2025, 50^2 = 2500, +475; 475 / 2025 = 19 / 81 = 23.4568 %.
    expect(outputOf(response, 'sail_area')).toEqual(
      expect.objectContaining({ unit: 'm^2', from: 2025, to: 2500, change: 475, dimensionChanged: false }),
    );
    expect(outputOf(response, 'sail_area')?.changePercent).toBeCloseTo((19 / 81) * 100, 10);
    // boom_mass = 4 booms * (side * sqrt(2) / 2) * density, with k = sqrt(2) / 2:
    // 4 * 45 * 0.015 kg/m * k = 2.7 k kg -> 4 * 50 * 0.012 kg/m * k = 2.4 k kg, change -0.3 k kg.
    const k = Math.SQRT2 / 2;
    const boomMass = outputOf(response, 'boom_mass');
    expect(boomMass?.from).toBeCloseTo(2.7 * k, 10);
    expect(boomMass?.to).toBeCloseTo(2.4 * k, 10);
    expect(boomMass?.change).toBeCloseTo(-0.3 * k, 10);
    expect(outputOf(response, 'solar_pressure_1au')).toEqual(expect.objectContaining({ change: 0, changePercent: 0 }));
    expect(outputOf(response, 'sail_side')).toBeUndefined();
  });

  it('shows what moved boom_mass: each changed input with its share, largest first, and the remainder', async () => {
    const { moved } = await compared(amara, `from=${copyId}&to=${draftId}&output=boom_mass`);
    const k = Math.SQRT2 / 2;
    // With the density back at 15 g/m: 4 * 50 * 0.015 * k = 3.0 k, share 2.4 k - 3.0 k = -0.6 k.
    // With the side back at 45 m: 4 * 45 * 0.012 * k = 2.16 k, share 2.4 k - 2.16 k = 0.24 k.
    // Remainder: -0.3 k - (-0.6 k + 0.24 k) = 0.06 k, the product of the two changes.
    expect(moved).toEqual(expect.objectContaining({ key: 'boom_mass', unit: 'kg', otherChanges: [] }));
    expect(moved?.inputs.map((input) => [input.key, input.from, input.to])).toEqual([
      ['boom_linear_density', 15, 12],
      ['sail_side', 45, 50],
    ]);
    expect(moved?.inputs[0]?.share).toBeCloseTo(-0.6 * k, 10);
    expect(moved?.inputs[1]?.share).toBeCloseTo(0.24 * k, 10);
    expect(moved?.remainder).toBeCloseTo(0.06 * k, 10);
    expect(moved?.hiddenShare).toBeUndefined();
  });

  it('shows a partner only the rows and outputs of the subsystems shared with them', async () => {
    const response = await compared(lucia, `from=${copyId}&to=${draftId}&output=sail_area`);
    expect(response.rows.changed.map((row) => row.key)).toEqual(['sail_side']);
    expect(new Set(response.outputs.map((output) => output.subsystem))).toEqual(new Set(['Sail membrane']));
    expect(outputOf(response, 'sail_area')).toEqual(expect.objectContaining({ from: 2025, to: 2500, change: 475 }));
    expect(response.moved?.inputs.map((input) => [input.key, input.share])).toEqual([['sail_side', 475]]);
    expect(JSON.stringify(response)).not.toContain('boom');
    await compare(lucia, `from=${copyId}&to=${draftId}&output=boom_mass`).expect(404);
  });

  it('sums the shares of changed inputs a partner does not see, without naming them', async () => {
    // Lucia's share moves from the sail membrane to the booms for this test.
    await testApp.sequelize.query(
      `UPDATE memberships m SET subsystem_ids = ARRAY(SELECT id FROM subsystems WHERE craft_id = $1 AND name = 'Booms')
       FROM users u WHERE u.id = m.user_id AND m.craft_id = $1 AND u.email LIKE 'lucia%'`,
      { bind: [ternId], type: QueryTypes.UPDATE },
    );
    try {
      const response = await compared(lucia, `from=${copyId}&to=${draftId}&output=boom_mass`);
      const k = Math.SQRT2 / 2;
      expect(response.rows.changed.map((row) => row.key)).toEqual(['boom_linear_density']);
      expect(response.moved?.inputs.map((input) => input.key)).toEqual(['boom_linear_density']);
      expect(response.moved?.hiddenShare).toBeCloseTo(0.24 * k, 10);
      expect(response.moved?.remainder).toBeCloseTo(0.06 * k, 10);
      expect(JSON.stringify(response)).not.toContain('sail_side');
    } finally {
      await testApp.sequelize.query(
        `UPDATE memberships m SET subsystem_ids = ARRAY(SELECT id FROM subsystems WHERE craft_id = $1 AND name = 'Sail membrane')
         FROM users u WHERE u.id = m.user_id AND m.craft_id = $1 AND u.email LIKE 'lucia%'`,
        { bind: [ternId], type: QueryTypes.UPDATE },
      );
    }
  });

  it('answers 404 for a revision of another craft and for a craft of another organisation', async () => {
    const skerry = await Craft.findOne({ where: { name: 'Skerry' }, rejectOnEmpty: true });
    const [skerryDraft] = await testApp.sequelize.query<{ id: string }>(`SELECT id FROM revisions WHERE craft_id = $1`, {
      bind: [skerry.id],
      type: QueryTypes.SELECT,
    });
    const response = await compare(amara, `from=${copyId}&to=${skerryDraft?.id ?? ''}`).expect(404);
    expect(response.body.error.code).toBe('not_found');
    const priya = await signIn(testApp.app, 'demo-priya', 'sso');
    await compare(priya, `from=${copyId}&to=${draftId}`).expect(404);
  });

  it('refuses bad query parameters with 400 naming each one', async () => {
    const missing = await compare(amara, `to=${draftId}&output=Bad-Key`).expect(400);
    expect(missing.body.error.details.map((detail: { path: string }) => detail.path)).toEqual(['query.from', 'query.output']);
    const notUuid = await compare(amara, `from=latest&to=${draftId}`).expect(400);
    expect(notUuid.body.error.message).toContain('query.from');
    await compare(amara, `from=${copyId}&to=${draftId}&output=no_such_row`).expect(404);
  });
});
