import { QueryTypes } from 'sequelize';
import { readDraft } from '../helpers/sheet';
import { setUpTern } from '../revisions/tern';
import { attach, detach, files, listed } from './fixtures';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'lucia', 'oren', 'ines']);
const { people } = tern;

const download = (session: (typeof people)['kenji'], attachmentId: string) =>
  session.agent
    .get(`/api/crafts/${tern.craftId}/attachments/${attachmentId}`)
    .buffer(true)
    .parse((response, done) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => done(null, Buffer.concat(chunks)));
    });

async function storedFiles(): Promise<number> {
  const [found] = await tern.testApp.sequelize.query<{ count: string }>('SELECT count(*) AS count FROM attachment_contents', {
    type: QueryTypes.SELECT,
  });
  return Number(found?.count);
}

describe('POST /api/crafts/:craftId/revisions/:revisionId/parameters/:key/attachments', () => {
  it('attaches a file to the row with its sniffed type, size, kind, who and when, and lists it on the row', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const response = await attach(people.kenji, draft.path, 'boom_mass', files.pdf, 'Boom datasheet.pdf').expect(201);
    expect(response.body).toEqual({
      id: expect.any(String),
      name: 'Boom datasheet.pdf',
      mediaType: 'application/pdf',
      size: files.pdf.length,
      kind: 'datasheet',
      uploadedBy: { id: expect.any(String), name: 'Kenji Hollis' },
      uploadedAt: expect.any(String),
      removable: true,
    });
    const list = await listed(people.oren, draft.path, 'boom_mass');
    expect(list.attachments).toEqual([expect.objectContaining({ id: response.body.id, name: 'Boom datasheet.pdf', removable: false })]);
    expect(list.attachRefusal).toBe('Viewers read the sheet but do not change it');
  });

  it('lists the newest first and keeps other rows apart', async () => {
    const draft = await readDraft(people.amara, tern.craftId);
    const first = await attach(people.amara, draft.path, 'bus_mass', files.csv, 'bus-weights.csv', 'test_report').expect(201);
    const second = await attach(people.amara, draft.path, 'bus_mass', files.png, 'bus.png', 'other').expect(201);
    const list = await listed(people.amara, draft.path, 'bus_mass');
    expect(list.attachments.map((file) => file.id)).toEqual([second.body.id, first.body.id]);
    expect(first.body.mediaType).toBe('text/plain');
    expect(second.body.mediaType).toBe('image/png');
    expect((await listed(people.amara, draft.path, 'payload_mass')).attachments).toEqual([]);
  });

  it('refuses a viewer, an organisation admin without a role and the owner of another subsystem with 403, writing nothing', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const before = await storedFiles();
    for (const session of [people.oren, people.ines]) {
      await attach(session, draft.path, 'boom_mass', files.pdf, 'a.pdf').expect(403);
    }
    const foreign = await attach(people.kenji, draft.path, 'membrane_mass', files.pdf, 'a.pdf').expect(403);
    expect(foreign.body.error.message).toMatch(/Sail membrane/);
    expect(await storedFiles()).toBe(before);
  });

  it('refuses a kind it does not know and a row that does not exist', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const kind = await attach(people.tomas, draft.path, 'boom_mass', files.pdf, 'a.pdf', 'invoice').expect(400);
    expect(kind.body.error.details).toEqual([expect.objectContaining({ path: 'body.kind' })]);
    await attach(people.tomas, draft.path, 'no_such_row', files.pdf, 'a.pdf').expect(404);
  });
});

describe('GET /api/crafts/:craftId/attachments/:attachmentId', () => {
  it('downloads the bytes as an attachment, typed as sniffed, never sniffed by the browser or cached', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const name = 'Wägebericht "Ausleger" 1.pdf';
    const uploaded = await attach(people.kenji, draft.path, 'boom_mass', files.pdf, name, 'weighing_report').expect(201);
    const response = await download(people.oren, uploaded.body.id).expect(200);
    expect(response.body).toEqual(files.pdf);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['cache-control']).toBe('private, no-store');
    const disposition = String(response.headers['content-disposition']);
    expect(disposition).toMatch(/^attachment; filename="W\?gebericht \\"Ausleger\\" 1\.pdf"; /);
    expect(disposition).toContain(`filename*=UTF-8''${encodeURIComponent(name).replace(/'/g, '%27')}`);
  });

  it('sends plain text as UTF-8 text', async () => {
    const draft = await readDraft(people.amara, tern.craftId);
    const uploaded = await attach(people.amara, draft.path, 'payload_mass', files.csv, 'payload.csv').expect(201);
    const response = await download(people.amara, uploaded.body.id).expect(200);
    expect(response.headers['content-type']).toBe('text/plain; charset=utf-8');
    expect(response.body).toEqual(files.csv);
  });

  it('answers 404 for a file of no row the person sees, and for one that does not exist', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const uploaded = await attach(people.kenji, draft.path, 'boom_mass', files.pdf, 'booms.pdf').expect(201);
    await download(people.lucia, uploaded.body.id).expect(404);
    await people.lucia.agent.get(`${draft.path}/parameters/boom_mass/attachments`).expect(404);
    await download(people.kenji, '00000000-0000-4000-8000-000000000000').expect(404);
  });
});

describe('partners', () => {
  it('attach to, list and download from rows of subsystems shared with them, and remove what they attached', async () => {
    const draft = await readDraft(people.lucia, tern.craftId);
    const own = await attach(people.lucia, draft.path, 'membrane_mass', files.pdf, 'Film datasheet.pdf').expect(201);
    const amaras = await attach(people.amara, draft.path, 'membrane_mass', files.csv, 'film.csv').expect(201);
    const list = await listed(people.lucia, draft.path, 'membrane_mass');
    expect(list.attachments.map((file) => [file.id, file.removable])).toEqual([
      [amaras.body.id, false],
      [own.body.id, true],
    ]);
    await download(people.lucia, amaras.body.id).expect(200);
    const refused = await detach(people.lucia, draft.path, 'membrane_mass', amaras.body.id).expect(403);
    expect(refused.body.error.message).toMatch(/whoever attached it/);
    await detach(people.lucia, draft.path, 'membrane_mass', own.body.id).expect(204);
  });

  it('get 404 for rows not shared with them, writing nothing', async () => {
    const draft = await readDraft(people.lucia, tern.craftId);
    const before = await storedFiles();
    await attach(people.lucia, draft.path, 'boom_mass', files.pdf, 'a.pdf').expect(404);
    expect(await storedFiles()).toBe(before);
  });
});

describe('DELETE /api/crafts/:craftId/revisions/:revisionId/parameters/:key/attachments/:attachmentId', () => {
  it('removes the file from the row and, named by no other row, deletes its bytes', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const uploaded = await attach(people.kenji, draft.path, 'deployer_mass', files.pdf, 'hinge.pdf').expect(201);
    const before = await storedFiles();
    await detach(people.oren, draft.path, 'deployer_mass', uploaded.body.id).expect(403);
    await detach(people.amara, draft.path, 'deployer_mass', uploaded.body.id).expect(204);
    expect((await listed(people.kenji, draft.path, 'deployer_mass')).attachments).toEqual([]);
    expect(await storedFiles()).toBe(before - 1);
    await download(people.kenji, uploaded.body.id).expect(404);
    await detach(people.amara, draft.path, 'deployer_mass', uploaded.body.id).expect(404);
  });

  it("lets the subsystem's owner remove a file someone else attached", async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const uploaded = await attach(people.tomas, draft.path, 'boom_mass', files.png, 'boom.png', 'other').expect(201);
    expect((await listed(people.kenji, draft.path, 'boom_mass')).attachments.find((file) => file.id === uploaded.body.id)?.removable).toBe(
      true,
    );
    await detach(people.kenji, draft.path, 'boom_mass', uploaded.body.id).expect(204);
  });

  it('deletes the files of a deleted row', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const created = await people.tomas.agent
      .post(`${draft.path}/parameters`)
      .set('x-csrf-token', people.tomas.csrfToken)
      .send({ parameter: { key: 'spare_hinge_mass', label: 'Spare hinge', subsystem: 'Booms', unit: 'kg', value: 0.1 } })
      .expect(201);
    const uploaded = await attach(people.tomas, draft.path, 'spare_hinge_mass', files.pdf, 'spare.pdf').expect(201);
    await people.tomas.agent
      .delete(`${draft.path}/parameters/spare_hinge_mass?version=${String(created.body.version)}`)
      .set('x-csrf-token', people.tomas.csrfToken)
      .expect(204);
    await download(people.tomas, uploaded.body.id).expect(404);
  });
});
