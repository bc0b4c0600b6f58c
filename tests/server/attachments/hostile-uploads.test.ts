import { QueryTypes } from 'sequelize';
import { evidenceMaxBytes } from '@/shared/schemas/attachments';
import { readDraft } from '../helpers/sheet';
import { setUpTern } from '../revisions/tern';
import { attach, files, listed } from './fixtures';

jest.setTimeout(60_000);

const tern = setUpTern(['amara']);
const { people } = tern;

async function counts() {
  const [found] = await tern.testApp.sequelize.query<{ files: string; contents: string; links: string }>(
    `SELECT (SELECT count(*) FROM attachments) AS files, (SELECT count(*) FROM attachment_contents) AS contents,
            (SELECT count(*) FROM row_attachments) AS links`,
    { type: QueryTypes.SELECT },
  );
  return found;
}

/** Uploads the file, expects the refusal, and checks that nothing was written and the server answers on. */
async function expectRefused(file: Buffer, name: string, status: number, code: string, message: RegExp) {
  const draft = await readDraft(people.amara, tern.craftId);
  const before = await counts();
  const response = await attach(people.amara, draft.path, 'bus_mass', file, name);
  expect(response.status).toBe(status);
  expect(response.body.error).toEqual(expect.objectContaining({ code, message: expect.stringMatching(message) }));
  expect(await counts()).toEqual(before);
  await people.amara.agent.get('/api/health').expect(200);
}

describe('hostile uploads', () => {
  it('refuses a file over the size limit with 413', async () => {
    await expectRefused(Buffer.alloc(evidenceMaxBytes + 1, 0x61), 'huge.txt', 413, 'file_too_large', /10 MB/);
  });

  it('refuses HTML and SVG, whatever they are called', async () => {
    await expectRefused(files.html, 'notes.txt', 415, 'unsupported_file_type', /notes\.txt is an HTML page/);
    await expectRefused(files.svg, 'drawing.png', 415, 'unsupported_file_type', /an SVG image/);
  });

  it('refuses an executable named as a PDF, naming what it is', async () => {
    await expectRefused(files.exe, 'datasheet.pdf', 415, 'unsupported_file_type', /datasheet\.pdf is a Windows executable/);
  });

  it('refuses an archive that is not a spreadsheet', async () => {
    await expectRefused(files.zip, 'weights.xlsx', 415, 'unsupported_file_type', /zip archive/);
  });

  it('refuses a file whose name claims another accepted type', async () => {
    await expectRefused(files.png, 'report.pdf', 415, 'file_type_mismatch', /PNG image by its content/);
  });

  it('refuses an empty file', async () => {
    await expectRefused(Buffer.alloc(0), 'empty.pdf', 400, 'file_empty', /empty\.pdf is empty/);
  });

  it('refuses a second file and unknown form fields', async () => {
    const draft = await readDraft(people.amara, tern.craftId);
    const before = await counts();
    const twice = await people.amara.agent
      .post(`${draft.path}/parameters/bus_mass/attachments`)
      .set('x-csrf-token', people.amara.csrfToken)
      .field('kind', 'datasheet')
      .attach('file', files.pdf, 'a.pdf')
      .attach('file', files.pdf, 'b.pdf');
    expect([twice.status, twice.body.error.code]).toEqual([400, 'unexpected_file']);
    const extra = await people.amara.agent
      .post(`${draft.path}/parameters/bus_mass/attachments`)
      .set('x-csrf-token', people.amara.csrfToken)
      .field('kind', 'datasheet')
      .field('uploadedBy', 'someone else')
      .attach('file', files.pdf, 'a.pdf');
    expect([extra.status, extra.body.error.code]).toEqual([400, 'unexpected_field']);
    expect(await counts()).toEqual(before);
  });

  it('stores a name with folders and control characters as its cleaned last part', async () => {
    const draft = await readDraft(people.amara, tern.craftId);
    const response = await attach(people.amara, draft.path, 'bus_mass', files.pdf, '..\\..\\windows/system32/%0Abus\u202Egnp.pdf').expect(
      201,
    );
    expect(response.body.name).toBe('busgnp.pdf');
    expect((await listed(people.amara, draft.path, 'bus_mass')).attachments[0]?.name).toBe('busgnp.pdf');
  });
});
