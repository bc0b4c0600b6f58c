import { QueryTypes } from 'sequelize';
import { patchRow, readDraft, rowOf } from '../helpers/sheet';
import { post, readRevision, revisionLabelled, setUpTern } from '../revisions/tern';
import { attach, detach, files, listed } from './fixtures';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'kenji']);
const { people } = tern;

async function storedContents(): Promise<number> {
  const [found] = await tern.testApp.sequelize.query<{ count: string }>('SELECT count(*) AS count FROM attachment_contents', {
    type: QueryTypes.SELECT,
  });
  return Number(found?.count);
}

describe('evidence in a locked baseline', () => {
  it('cannot be attached or removed, and the database refuses it too', async () => {
    const pdr = await revisionLabelled(people.tomas, tern.craftId, 'PDR');
    const path = `/api/crafts/${tern.craftId}/revisions/${pdr.id}`;
    const refused = await attach(people.tomas, path, 'boom_mass', files.pdf, 'late.pdf').expect(403);
    expect(refused.body.error.message).toBe('This baseline is locked: its rows cannot change');
    expect((await listed(people.tomas, path, 'boom_mass')).attachRefusal).toBe('This baseline is locked: its rows cannot change');

    const draft = await readDraft(people.tomas, tern.craftId);
    const uploaded = await attach(people.tomas, draft.path, 'boom_mass', files.pdf, 'draft.pdf').expect(201);
    await expect(
      tern.testApp.sequelize.query(
        `INSERT INTO row_attachments (parameter_id, attachment_id)
         SELECT id, $2 FROM revision_parameters WHERE revision_id = $1 AND key = 'boom_mass'`,
        { bind: [pdr.id, uploaded.body.id] },
      ),
    ).rejects.toThrow(/is locked/);
  });
});

describe('evidence follows its rows into copies of the revision', () => {
  it('into a study, naming the same file without copying its bytes; a removal in the study leaves the draft alone', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const uploaded = await attach(people.kenji, draft.path, 'deployer_mass', files.pdf, 'hinge.pdf').expect(201);
    const before = await storedContents();

    const opened = await post(people.kenji, `${draft.path}/studies`, { name: 'Evidence study' }).expect(201);
    const study = await readRevision(people.kenji, tern.craftId, opened.body.id);
    expect((await listed(people.kenji, study.path, 'deployer_mass')).attachments.map((file) => file.id)).toEqual([uploaded.body.id]);
    expect(await storedContents()).toBe(before);

    await detach(people.kenji, study.path, 'deployer_mass', uploaded.body.id).expect(204);
    expect((await listed(people.kenji, study.path, 'deployer_mass')).attachments).toEqual([]);
    expect((await listed(people.kenji, draft.path, 'deployer_mass')).attachments.map((file) => file.id)).toEqual([uploaded.body.id]);
    expect(await storedContents()).toBe(before);
  });

  it('into a baseline locked from the draft', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const uploaded = await attach(people.tomas, draft.path, 'bus_mass', files.png, 'bus.png', 'other').expect(201);
    const locked = await post(people.tomas, `${draft.path}/lock`, { label: 'CDR' }).expect(201);
    const baselinePath = `/api/crafts/${tern.craftId}/revisions/${String(locked.body.id)}`;
    expect((await listed(people.tomas, baselinePath, 'bus_mass')).attachments.map((file) => file.id)).toContain(uploaded.body.id);
    await detach(people.tomas, baselinePath, 'bus_mass', uploaded.body.id).expect(403);
  });

  it('back into the draft when a study is promoted, with the measured maturity it supports', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const opened = await post(people.kenji, `${draft.path}/studies`, { name: 'Weighed booms' }).expect(201);
    const study = await readRevision(people.kenji, tern.craftId, opened.body.id);
    const report = await attach(people.kenji, study.path, 'boom_mass', files.pdf, 'booms weighed.pdf', 'weighing_report').expect(201);
    const row = rowOf(study, 'boom_mass');
    await patchRow(people.kenji, study.path, 'boom_mass', { version: row.version, mass: { ...row.mass, maturity: 'measured' } }).expect(
      200,
    );
    expect((await listed(people.kenji, draft.path, 'boom_mass')).attachments.map((file) => file.id)).not.toContain(report.body.id);

    await post(people.tomas, `/api/crafts/${tern.craftId}/revisions/${study.revision.id}/promote`, { resolutions: {} }).expect(200);
    const promoted = await readDraft(people.kenji, tern.craftId);
    expect(rowOf(promoted, 'boom_mass').mass?.maturity).toBe('measured');
    expect((await listed(people.kenji, draft.path, 'boom_mass')).attachments.map((file) => file.id)).toContain(report.body.id);
    await detach(people.tomas, draft.path, 'boom_mass', report.body.id).expect(409);
  });
});
