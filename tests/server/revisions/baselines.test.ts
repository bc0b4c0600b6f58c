import { QueryTypes } from 'sequelize';
import { patchRow, readDraft, rowOf } from '../helpers/sheet';
import { listRevisions, post, readRevision, revisionLabelled, setUpTern } from './tern';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'oren']);
const { people } = tern;

const lockPath = (revisionId: string) => `/api/crafts/${tern.craftId}/revisions/${revisionId}/lock`;

async function count(sql: string, bind: unknown[]): Promise<number> {
  const [row] = await tern.testApp.sequelize.query<{ n: string }>(sql, { bind, type: QueryTypes.SELECT });
  return Number(row?.n);
}

describe("Tern's seeded PDR baseline", () => {
  it('holds the draft as it was before the later edits, locked by the chief engineer, and the draft continues from it', async () => {
    const pdr = await revisionLabelled(people.oren, tern.craftId, 'PDR');
    expect(pdr).toEqual(
      expect.objectContaining({ kind: 'baseline', state: 'locked', lockedBy: expect.objectContaining({ name: 'Tomás Reyes' }) }),
    );
    expect(pdr.note).toMatch(/Preliminary design review/);
    const baseline = await readRevision(people.oren, tern.craftId, pdr.id);
    expect(rowOf(baseline, 'sail_side')).toEqual(expect.objectContaining({ value: 40, version: 1 }));
    expect(rowOf(baseline, 'mass_allocation').value).toBe(35);
    expect(rowOf(baseline, 'boom_linear_density')).toEqual(expect.objectContaining({ value: 15, version: 2 }));
    expect(rowOf(baseline, 'deployer_mass').subsystem).toBe('Deployer');
    const draft = await readDraft(people.oren, tern.craftId);
    expect(draft.revision.parentId).toBe(pdr.id);
    expect(rowOf(draft, 'sail_side').value).toBe(45);
    expect(baseline.abilities).toEqual(expect.objectContaining({ editableSubsystemIds: [], manageRows: false }));
  });
});

describe('POST /api/crafts/:craftId/revisions/:revisionId/lock', () => {
  it('copies the draft into a locked baseline with label, note, who and when; the draft continues with its versions', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const previous = draft.revision.parentId;
    const response = await post(people.tomas, lockPath(draft.revision.id), { label: 'CDR', note: 'Critical design review pack.' }).expect(
      201,
    );
    expect(response.body).toEqual(
      expect.objectContaining({
        kind: 'baseline',
        state: 'locked',
        label: 'CDR',
        note: 'Critical design review pack.',
        parentId: previous,
        createdBy: expect.objectContaining({ name: 'Tomás Reyes' }),
        lockedBy: expect.objectContaining({ name: 'Tomás Reyes' }),
        lockedAt: expect.any(String),
      }),
    );
    const baseline = await readRevision(people.tomas, tern.craftId, response.body.id);
    const strip = ({ updatedAt: _updatedAt, ...row }: (typeof draft.sheet.parameters)[number]) => row;
    expect(baseline.sheet.parameters.map(strip)).toEqual(draft.sheet.parameters.map(strip));
    expect(baseline.sheet.name).toBe(draft.sheet.name);
    const after = await readDraft(people.tomas, tern.craftId);
    expect(after.revision.parentId).toBe(response.body.id);
    expect(after.sheet.parameters.map((row) => row.version)).toEqual(draft.sheet.parameters.map((row) => row.version));

    // The draft is still edited at the versions people read before the lock.
    const sailSide = rowOf(draft, 'sail_side');
    await patchRow(people.amara, after.path, 'sail_side', { version: sailSide.version, value: 46 }).expect(200);
    expect(rowOf(await readRevision(people.tomas, tern.craftId, response.body.id), 'sail_side').value).toBe(45);
  });

  it('refuses everyone but chief engineers with 403, and writes nothing', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const before = (await listRevisions(people.tomas, tern.craftId)).length;
    for (const session of [people.amara, people.kenji, people.oren]) {
      const refused = await post(session, lockPath(draft.revision.id), { label: 'Not mine to lock' }).expect(403);
      expect(refused.body.error.code).toBe('forbidden');
    }
    expect(await listRevisions(people.tomas, tern.craftId)).toHaveLength(before);
  });

  it('needs a label, names the field, and refuses a label another baseline has (in any case) with 409', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const missing = await post(people.tomas, lockPath(draft.revision.id), { note: 'no label' }).expect(400);
    expect(missing.body.error.details).toEqual([expect.objectContaining({ path: 'body.label' })]);
    const unstorable = await post(people.tomas, lockPath(draft.revision.id), { label: 'PDR\u0000b', note: 7 }).expect(400);
    expect(unstorable.body.error.details.map((problem: { path: string }) => problem.path)).toEqual(['body.label', 'body.note']);
    const blank = await post(people.tomas, lockPath(draft.revision.id), { label: '   ' }).expect(400);
    expect(blank.body.error.details).toEqual([expect.objectContaining({ path: 'body.label', message: 'must not be empty' })]);
    const before = (await listRevisions(people.tomas, tern.craftId)).length;
    const duplicate = await post(people.tomas, lockPath(draft.revision.id), { label: 'pdr' }).expect(409);
    expect(duplicate.body.error).toEqual(expect.objectContaining({ code: 'duplicate_label', message: expect.stringContaining('"PDR"') }));
    expect(await listRevisions(people.tomas, tern.craftId)).toHaveLength(before);
  });

  it('locks only the working draft: a baseline or a study is 409 not_a_draft', async () => {
    for (const label of ['PDR', 'Lighter deployer hinge']) {
      const revision = await revisionLabelled(people.tomas, tern.craftId, label);
      const refused = await post(people.tomas, lockPath(revision.id), { label: `Again ${label}` }).expect(409);
      expect(refused.body.error.code).toBe('not_a_draft');
    }
  });
});

describe('a locked baseline', () => {
  it('refuses every row edit through the API with 403 saying it is locked, even to the chief engineer', async () => {
    const pdr = await readRevision(people.tomas, tern.craftId, (await revisionLabelled(people.tomas, tern.craftId, 'PDR')).id);
    const row = rowOf(pdr, 'sail_side');
    const patched = await patchRow(people.tomas, pdr.path, 'sail_side', { version: row.version, value: 41 }).expect(403);
    expect(patched.body.error.message).toBe('This baseline is locked: its rows cannot change');
    const created = await post(people.tomas, `${pdr.path}/parameters`, {
      parameter: { key: 'late_row', label: 'Late row', subsystem: 'Spacecraft', unit: 'kg', value: 1 },
    }).expect(403);
    expect(created.body.error.message).toMatch(/locked/);
    const deleted = await people.tomas.agent
      .delete(`${pdr.path}/parameters/front_coating_thickness?version=1`)
      .set('x-csrf-token', people.tomas.csrfToken)
      .expect(403);
    expect(deleted.body.error.message).toMatch(/locked/);
    expect(rowOf(await readRevision(people.tomas, tern.craftId, pdr.revision.id), 'sail_side')).toEqual(row);
  });

  it('is refused by the database too: UPDATE, DELETE and INSERT of its rows, and UPDATE and DELETE of the revision', async () => {
    const { id } = await revisionLabelled(people.tomas, tern.craftId, 'PDR');
    const { sequelize } = tern.testApp;
    await expect(
      sequelize.query(`UPDATE revision_parameters SET value = 1 WHERE revision_id = $1 AND key = 'sail_side'`, { bind: [id] }),
    ).rejects.toThrow(/locked: its rows cannot change/);
    await expect(sequelize.query(`DELETE FROM revision_parameters WHERE revision_id = $1`, { bind: [id] })).rejects.toThrow(/locked/);
    await expect(
      sequelize.query(
        `INSERT INTO revision_parameters (id, revision_id, subsystem_id, key, position, label, unit, value)
         SELECT gen_random_uuid(), revision_id, subsystem_id, 'smuggled', 999, 'Smuggled', unit, 1 FROM revision_parameters
         WHERE revision_id = $1 AND key = 'sail_side'`,
        { bind: [id] },
      ),
    ).rejects.toThrow(/locked/);
    await expect(sequelize.query(`UPDATE revisions SET label = 'PDR (edited)' WHERE id = $1`, { bind: [id] })).rejects.toThrow(
      /is locked: it cannot be changed or deleted/,
    );
    await expect(sequelize.query(`UPDATE revisions SET state = 'open', locked_at = NULL WHERE id = $1`, { bind: [id] })).rejects.toThrow(
      /locked/,
    );
    await expect(sequelize.query(`DELETE FROM revisions WHERE id = $1`, { bind: [id] })).rejects.toThrow(/locked/);
    // Moving a draft row into the baseline is an insert into it as far as the baseline is concerned.
    const draftId = (await readDraft(people.tomas, tern.craftId)).revision.id;
    await expect(
      sequelize.query(`UPDATE revision_parameters SET revision_id = $1, key = 'moved_row' WHERE revision_id = $2 AND key = 'cone_angle'`, {
        bind: [id, draftId],
      }),
    ).rejects.toThrow(/locked/);

    expect(
      await count(`SELECT count(*) AS n FROM revision_parameters WHERE revision_id = $1 AND key IN ('smuggled', 'moved_row')`, [id]),
    ).toBe(0);
    expect(
      await count(`SELECT count(*) AS n FROM revision_parameters WHERE revision_id = $1 AND key = 'sail_side' AND value = 40`, [id]),
    ).toBe(1);
  });

  it('leaves the open draft free to change through SQL (the triggers look only at locked revisions)', async () => {
    const draftId = (await readDraft(people.tomas, tern.craftId)).revision.id;
    await tern.testApp.sequelize.transaction(async (transaction) => {
      await tern.testApp.sequelize.query(`UPDATE revision_parameters SET note = 'checked' WHERE revision_id = $1 AND key = 'cone_angle'`, {
        bind: [draftId],
        transaction,
      });
      await tern.testApp.sequelize.query(`UPDATE revisions SET note = 'checked' WHERE id = $1`, { bind: [draftId], transaction });
    });
    expect(await count(`SELECT count(*) AS n FROM revision_parameters WHERE revision_id = $1 AND note = 'checked'`, [draftId])).toBe(1);
  });

  it('keeps its craft from being deleted outright (no service deletes crafts; one would have to lift the lock deliberately)', async () => {
    await expect(tern.testApp.sequelize.query('DELETE FROM crafts WHERE id = $1', { bind: [tern.craftId] })).rejects.toThrow(/locked/);
    expect(await count('SELECT count(*) AS n FROM crafts WHERE id = $1', [tern.craftId])).toBe(1);
  });
});
