import { findPreset } from '@/shared/budget/presets';
import { rollUpBudget } from '@/shared/budget/rollup';
import type { AllowancePreset, BudgetRowInput } from '@/shared/budget/types';
import { allowanceTableResponseSchema } from '@/shared/schemas/allowance-tables';
import { evaluationResponseSchema } from '@/shared/schemas/revisions';
import type { Session } from '../helpers/sheet';
import { patchRow, readDraft, rowOf } from '../helpers/sheet';
import { setUpTern } from '../revisions/tern';

jest.setTimeout(60_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'lucia', 'oren', 'priya']);
const { people } = tern;
const path = () => `/api/crafts/${tern.craftId}/allowance-table`;
const put = (session: Session, body: unknown) =>
  session.agent
    .put(path())
    .set('x-csrf-token', session.csrfToken)
    .send(body as object);

const found = findPreset('aiaa-s120a');
if (found === undefined) throw new Error('aiaa-s120a preset missing');
const aiaa: AllowancePreset = found;

/** A team's own table: the AIAA-style maturities and categories plus one of the team's, every cell 50 %. */
function teamTable(percent = 50): AllowancePreset {
  const maturities = [...aiaa.maturities, { id: 'team_estimate', label: 'Team estimate' }];
  const table = Object.fromEntries(
    maturities.map((maturity) => [maturity.id, Object.fromEntries(aiaa.categories.map((category) => [category.id, percent / 100]))]),
  );
  return {
    id: 'corvid-table',
    name: 'Corvid allowances',
    source: 'Corvid Sailworks mass-properties plan, issue 2',
    caveat: 'Our own cells, from our licensed copy of the standard.',
    maturities,
    categories: aiaa.categories,
    table,
    systemMarginPercent: 20,
    systemMarginBasis: 'predicted',
  };
}

describe('GET and PUT /api/crafts/:craftId/allowance-table', () => {
  it('answers null while the craft has no table of its own', async () => {
    const response = await people.oren.agent.get(path()).expect(200);
    expect(allowanceTableResponseSchema.parse(response.body)).toEqual({ table: null, updatedBy: null, updatedAt: null });
  });

  it('refuses a subsystem owner, a partner and a viewer with 403, and hides the craft from another organisation', async () => {
    for (const person of [people.kenji, people.lucia, people.oren]) {
      const response = await put(person, { table: teamTable() }).expect(403);
      expect(response.body.error.message).toMatch(/editAllowanceTable/);
    }
    await put(people.priya, { table: teamTable() }).expect(404);
    await people.priya.agent.get(path()).expect(404);
  });

  it.each([
    [
      'an allowance above 100 %',
      (t: AllowancePreset) => ({ ...t, table: { ...t.table, layout: { ...t.table.layout, harness: 1.5 } } }),
      'body.table.table.layout.harness',
    ],
    [
      'a negative allowance',
      (t: AllowancePreset) => ({ ...t, table: { ...t.table, layout: { ...t.table.layout, boom: -0.1 } } }),
      'body.table.table.layout.boom',
    ],
    [
      'an allowance as text',
      (t: AllowancePreset) => ({ ...t, table: { ...t.table, layout: { ...t.table.layout, boom: '20 %' } } }),
      'body.table.table.layout.boom',
    ],
    ['a missing row', (t: AllowancePreset) => ({ ...t, table: { ...t.table, layout: undefined } }), 'body.table.table.layout'],
    [
      'a row of no maturity',
      (t: AllowancePreset) => ({ ...t, table: { ...t.table, guessed: t.table.layout } }),
      'body.table.table.guessed',
    ],
    ['a system margin of 100 %', (t: AllowancePreset) => ({ ...t, systemMarginPercent: 100 }), 'body.table.systemMarginPercent'],
    ['an unknown margin basis', (t: AllowancePreset) => ({ ...t, systemMarginBasis: 'launch' }), 'body.table.systemMarginBasis'],
    ['a notice of its own', (t: AllowancePreset) => ({ ...t, notice: 'Standard table' }), 'body.table'],
    [
      'a malformed maturity id',
      (t: AllowancePreset) => ({ ...t, maturities: [...t.maturities, { id: 'Bad Id', label: 'x' }] }),
      'body.table.maturities.8.id',
    ],
    [
      'more maturities than a table holds',
      (t: AllowancePreset) => ({ ...t, maturities: Array.from({ length: 31 }, (_, i) => ({ id: `m${i}x`, label: 'm' })) }),
      'body.table.maturities',
    ],
  ])('refuses %s with 400 naming where, and keeps nothing', async (_what, change, where) => {
    const response = await put(people.tomas, { table: change(teamTable()) }).expect(400);
    expect(response.body.error.code).toBe('invalid_input');
    expect(response.body.error.details.map((detail: { path: string }) => detail.path)).toContain(where);
    const after = await people.oren.agent.get(path()).expect(200);
    expect(after.body.table).toBeNull();
  });

  it('refuses a body that is not a table or past the size limit, and never lets a key reach the prototype', async () => {
    await put(people.tomas, { table: 'everything 10 %' }).expect(400);
    await put(people.tomas, {}).expect(400);
    const hostile = JSON.stringify({ table: teamTable() }).replace(
      '"table":{"estimated"',
      '"table":{"__proto__":{"polluted":1},"estimated"',
    );
    const response = await people.tomas.agent
      .put(path())
      .set('x-csrf-token', people.tomas.csrfToken)
      .set('content-type', 'application/json')
      .send(hostile);
    // The schema drops a "__proto__" key rather than setting a prototype with it: the table is saved without it.
    expect(response.status).toBe(200);
    expect(Object.keys(response.body.table.table)).not.toContain('__proto__');
    expect(response.body.table.table.polluted).toBeUndefined();
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    // A body past the size limit is refused before it is read.
    const huge = { table: { ...teamTable(), maturities: Array.from({ length: 40_000 }, (_, i) => ({ id: `m${i}x`, label: 'm' })) } };
    await put(people.tomas, huge).expect(413);
  });

  it('saves the table of a systems or chief engineer, for everyone on the craft to read', async () => {
    const saved = await put(people.amara, { table: teamTable(40) }).expect(200);
    expect(saved.body.updatedBy.name).toMatch(/Amara/);
    const response = await put(people.tomas, { table: teamTable() }).expect(200);
    const body = allowanceTableResponseSchema.parse(response.body);
    expect(body.table).toEqual(teamTable());
    expect(body.updatedBy?.name).toMatch(/Tom/);
    const read = await people.lucia.agent.get(path()).expect(200);
    expect(read.body.table).toEqual(teamTable());
  });

  it("rolls the budget up on the server with the craft's own table", async () => {
    await put(people.tomas, { table: teamTable() }).expect(200);
    const draft = await readDraft(people.tomas, tern.craftId);
    const evaluation = evaluationResponseSchema.parse((await people.tomas.agent.get(`${draft.path}/evaluation`).expect(200)).body);
    if (!evaluation.budget.ok) throw new Error(JSON.stringify(evaluation.budget.errors));
    // Every allowance is the team's 50 %: predicted = 1.5 × basic mass, line by line.
    for (const line of evaluation.budget.result.rows) {
      expect(line.allowance).toBe(0.5);
      expect(line.predicted).toBeCloseTo(line.cbe * 1.5, 10);
    }
    // The same roll-up made here from the lines and the table (AIAA S-120A-2015 predicted mass; ESA-style 20 % of predicted).
    const lines: BudgetRowInput[] = evaluation.budget.result.rows.map(({ key, subsystem, cbe, maturity, category }) => ({
      key,
      subsystem,
      cbe,
      maturity,
      category,
    }));
    const allocation = evaluation.values.mass_allocation?.value ?? Number.NaN;
    const expected = rollUpBudget(lines, teamTable(), {
      allocation,
      requiredMarginPercent: draft.sheet.budget?.requiredMarginPercent ?? 20,
    });
    expect(evaluation.budget.result.total.predicted).toBeCloseTo(expected.total.predicted, 10);
    expect(evaluation.budget.result.systemMargin.requiredBasis).toBe('predicted');
    // The sheet's own predicted-mass row reads the same table.
    expect(evaluation.values.predicted_mass?.value).toBeCloseTo(expected.total.predicted, 10);
  });

  it("lets a mass row name a maturity of the craft's own table", async () => {
    await put(people.tomas, { table: teamTable() }).expect(200);
    const draft = await readDraft(people.tomas, tern.craftId);
    const row = rowOf(draft, 'payload_mass');
    const response = await patchRow(people.tomas, draft.path, 'payload_mass', {
      version: row.version,
      mass: { maturity: 'team_estimate', category: row.mass?.category ?? 'payload' },
    }).expect(200);
    expect(response.body.mass.maturity).toBe('team_estimate');
  });
});
