import { patchRow, readDraft, rowOf } from '../helpers/sheet';
import { setUpTern } from '../revisions/tern';
import { attach, detach, files } from './fixtures';

jest.setTimeout(30_000);

const tern = setUpTern(['kenji', 'tomas']);
const { people } = tern;

/** Sets the row's maturity as Kenji, at the version the draft has now, expecting the status. */
async function setMaturity(key: string, maturity: string, status: number) {
  const draft = await readDraft(people.kenji, tern.craftId);
  const row = rowOf(draft, key);
  return patchRow(people.kenji, draft.path, key, { version: row.version, mass: { ...row.mass, maturity } }).expect(status);
}

// common practice: a mass counts as measured (0 % allowance) only with the weighing of the item on record.
describe('the measured maturity', () => {
  it('is refused with 409 naming the row while the row has no weighing report, and nothing changes', async () => {
    const before = rowOf(await readDraft(people.kenji, tern.craftId), 'boom_mass');
    const refused = await setMaturity('boom_mass', 'measured', 409);
    expect(refused.body.error).toEqual({
      code: 'evidence_required',
      message: expect.stringContaining('"boom_mass"'),
      details: [{ path: 'body.mass.maturity', message: expect.stringMatching(/weighing report/) }],
    });
    expect(rowOf(await readDraft(people.kenji, tern.craftId), 'boom_mass')).toEqual(before);
  });

  it('is refused while the row has evidence of other kinds only', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    await attach(people.kenji, draft.path, 'boom_mass', files.pdf, 'datasheet.pdf', 'datasheet').expect(201);
    await attach(people.kenji, draft.path, 'boom_mass', files.pdf, 'vibration.pdf', 'test_report').expect(201);
    await setMaturity('boom_mass', 'measured', 409);
  });

  it('is accepted once a weighing report is attached; that last report then stays until the maturity changes', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const report = await attach(people.kenji, draft.path, 'boom_mass', files.pdf, 'weighing.pdf', 'weighing_report').expect(201);
    const accepted = await setMaturity('boom_mass', 'measured', 200);
    expect(accepted.body.mass).toEqual({ maturity: 'measured', category: 'boom' });

    const kept = await detach(people.tomas, draft.path, 'boom_mass', report.body.id).expect(409);
    expect(kept.body.error).toEqual(
      expect.objectContaining({ code: 'evidence_required', message: expect.stringMatching(/"boom_mass" is measured.*weighing\.pdf/) }),
    );

    const second = await attach(people.kenji, draft.path, 'boom_mass', files.pdf, 'reweighing.pdf', 'weighing_report').expect(201);
    await detach(people.kenji, draft.path, 'boom_mass', report.body.id).expect(204);
    await detach(people.kenji, draft.path, 'boom_mass', second.body.id).expect(409);

    await setMaturity('boom_mass', 'existing_hardware', 200);
    await detach(people.kenji, draft.path, 'boom_mass', second.body.id).expect(204);
  });

  it('refuses a new row that claims to be measured', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const response = await people.tomas.agent
      .post(`${draft.path}/parameters`)
      .set('x-csrf-token', people.tomas.csrfToken)
      .send({
        parameter: {
          key: 'hinge_mass',
          label: 'Hinge',
          subsystem: 'Booms',
          unit: 'kg',
          value: 0.2,
          mass: { maturity: 'measured', category: 'mechanism' },
        },
      })
      .expect(409);
    expect(response.body.error.message).toContain('"hinge_mass"');
    expect((await readDraft(people.tomas, tern.craftId)).sheet.parameters.some((row) => row.key === 'hinge_mass')).toBe(false);
  });

  it('leaves other changes of other rows alone', async () => {
    await setMaturity('deployer_mass', 'layout', 200);
  });
});
