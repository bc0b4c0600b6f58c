import { QueryTypes } from 'sequelize';
import { IMPORT_LIMITS } from '@/shared/exchange/layout';
import { readDraft } from '../helpers/sheet';
import { listRevisions, setUpTern } from '../revisions/tern';
import { download, openWorkbook, saveWorkbook, unzip, upload, workbookBomb, zipOf } from './workbook-files';

jest.setTimeout(120_000);

/**
 * Hostile files sent to the imports route: each is a 4xx naming the problem, nothing is written, and the server
 * still answers afterwards. The zip checks run before any spreadsheet library parses the file.
 */
const tern = setUpTern(['tomas']);

let revisionId = '';
let exported: Buffer;

beforeAll(async () => {
  const draft = await readDraft(tern.people.tomas, tern.craftId);
  revisionId = draft.revision.id;
  exported = (await download(tern.people.tomas, tern.craftId, revisionId, 'xlsx')).bytes;
});

/** The exported workbook with some parts replaced or added (by name). */
async function rezipped(changes: Record<string, Buffer>): Promise<Buffer> {
  const entries = await unzip(exported);
  const kept = entries.map((entry) => ({ name: entry.name, data: changes[entry.name] ?? entry.data }));
  const added = Object.entries(changes)
    .filter(([name]) => !entries.some((entry) => entry.name === name))
    .map(([name, data]) => ({ name, data }));
  return zipOf([...kept, ...added]);
}

/** The exported workbook with a formula put into Parameters!F2 by exceljs. */
async function withFormula(formula: string): Promise<Buffer> {
  const workbook = await openWorkbook(exported);
  const parameters = workbook.getWorksheet('Parameters');
  if (!parameters) throw new Error('no Parameters sheet');
  parameters.getCell('F2').value = { formula };
  return saveWorkbook(workbook);
}

async function counts() {
  const [imports] = await tern.testApp.sequelize.query<{ count: string }>('SELECT count(*) FROM imports', { type: QueryTypes.SELECT });
  return { imports: Number(imports?.count), revisions: (await listRevisions(tern.people.tomas, tern.craftId)).length };
}

async function expectRefused(bytes: Buffer, fileName: string, status: number, code: string, message: RegExp) {
  const before = await counts();
  const response = await upload(tern.people.tomas, tern.craftId, revisionId, bytes, fileName);
  expect({ status: response.status, code: response.body.error?.code }).toEqual({ status, code });
  expect(response.body.error.message).toMatch(message);
  expect(await counts()).toEqual(before);
  await tern.people.tomas.agent.get('/api/health').expect(200);
}

describe('POST /api/crafts/:craftId/revisions/:revisionId/imports with hostile files', () => {
  it('refuses a file over the size limit with 413', async () => {
    const large = Buffer.concat([exported, Buffer.alloc(IMPORT_LIMITS.maxFileBytes)]);
    await expectRefused(large, 'large.xlsx', 413, 'file_too_large', /larger than the limit of 8 MB/);
  });

  it('sniffs the type from the content, not the name', async () => {
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj << >> endobj\ntrailer << >>\n%%EOF\n');
    await expectRefused(pdf, 'budget.xlsx', 415, 'unsupported_file_type', /budget\.xlsx is a PDF by its content/);
    await expectRefused(
      Buffer.from('key,value\nsail_side,40\n'),
      'budget.csv',
      415,
      'unsupported_file_type',
      /is plain text by its content/,
    );
  });

  it('refuses an encrypted workbook (an OLE container) with 415', async () => {
    const ole = Buffer.concat([Buffer.from('d0cf11e0a1b11ae1', 'hex'), Buffer.alloc(1024)]);
    await expectRefused(ole, 'secret.xlsx', 415, 'file_type_mismatch', /encrypted workbook/);
    await expectRefused(ole, 'secret', 415, 'encrypted_workbook', /encrypted \(password-protected\) workbook/);
  });

  it('refuses a macro-enabled .xlsm and a workbook carrying a VBA project with 415', async () => {
    const contentTypes = (await unzip(exported)).find((entry) => entry.name === '[Content_Types].xml')?.data.toString() ?? '';
    const xlsm = await rezipped({
      '[Content_Types].xml': Buffer.from(
        contentTypes.replace(
          'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml',
          'application/vnd.ms-excel.sheet.macroEnabled.main+xml',
        ),
      ),
    });
    await expectRefused(xlsm, 'partner.xlsm', 415, 'macro_workbook', /macro-enabled \(\.xlsm\)/);
    const vba = await rezipped({ 'xl/vbaProject.bin': Buffer.from('not really a VBA project, but named as one') });
    await expectRefused(vba, 'partner.xlsx', 415, 'macro_workbook', /carries macros/);
  });

  it('refuses a zip bomb by its declared size, and by the bytes it really unpacks to, with memory bounded', async () => {
    const honest = await workbookBomb(400, 'truth');
    const lying = await workbookBomb(400, 'lie');
    expect(lying.length).toBeLessThan(2 * 1024 * 1024);
    await expectRefused(honest, 'bomb.xlsx', 413, 'unpacked_too_large', /declares 400(\.\d)? MB unpacked, above the limit of 64 MB/);
    const before = process.memoryUsage().rss;
    let peak = before;
    const sampler = setInterval(() => {
      peak = Math.max(peak, process.memoryUsage().rss);
    }, 2);
    try {
      await expectRefused(lying, 'bomb.xlsx', 413, 'unpacked_too_large', /unpacks to more than 64 MB \(counted while unpacking/);
    } finally {
      clearInterval(sampler);
    }
    // Unpacked plainly it would take 400 MB for the text alone; counted as a stream it takes a few chunks.
    expect(peak - before).toBeLessThan(200 * 1024 * 1024);
  });

  it('refuses malformed XML with 400', async () => {
    const broken = await rezipped({ 'xl/worksheets/sheet2.xml': Buffer.from('<?xml version="1.0"?><worksheet><sheetData><row r="1"><c') });
    await expectRefused(broken, 'broken.xlsx', 400, 'malformed_workbook', /cannot be read/);
  });

  it('refuses links to other files and formulas that reach other files, with 400 naming the cell', async () => {
    const linked = await rezipped({ 'xl/externalLinks/externalLink1.xml': Buffer.from('<?xml version="1.0"?><externalLink/>') });
    await expectRefused(linked, 'linked.xlsx', 400, 'external_links', /links to other files/);
    await expectRefused(
      await withFormula('[1]Prices!A1*2'),
      'linked.xlsx',
      400,
      'external_reference',
      /Parameters!F2 refers to another file/,
    );
  });

  it('refuses formulas calling functions Trimsheet does not know, with 400 naming the cell and function', async () => {
    await expectRefused(
      await withFormula('WEBSERVICE("http://attacker.example")'),
      'partner.xlsx',
      400,
      'unknown_function',
      /Parameters!F2 calls WEBSERVICE/,
    );
  });

  it(`refuses a sheet above ${IMPORT_LIMITS.maxSheetRows} rows with 413, before parsing it`, async () => {
    const rows = Array.from({ length: 100_000 }, (_, index) => `<row r="${index + 1}"/>`).join('');
    const tall = await rezipped({
      'xl/worksheets/sheet2.xml': Buffer.from(`<?xml version="1.0"?><worksheet><sheetData>${rows}</sheetData></worksheet>`),
    });
    await expectRefused(tall, 'tall.xlsx', 413, 'too_many_rows', /has 100000 rows, above the limit of 20,000 rows a sheet/);
  });

  it('refuses a zip that is not a workbook, and a workbook not in our layout', async () => {
    await expectRefused(
      zipOf([{ name: 'notes.txt', data: Buffer.from('hello') }]),
      'notes.zip',
      415,
      'not_a_workbook',
      /zip archive but not an Excel workbook/,
    );
    const workbook = await openWorkbook(exported);
    const parameters = workbook.getWorksheet('Parameters');
    if (!parameters) throw new Error('no Parameters sheet');
    parameters.getCell('D1').value = 'Amount';
    await expectRefused(await saveWorkbook(workbook), 'other.xlsx', 400, 'not_trimsheet_layout', /Parameters!D1 should read "Value"/);
  });
});
