import type ExcelJS from 'exceljs';
import { QueryTypes } from 'sequelize';
import { evaluateSheet } from '@/shared/engine';
import { PARAMETER_COLUMNS } from '@/shared/exchange/layout';
import type { ImportPreview } from '@/shared/schemas/exchange';
import type { RevisionDetail } from '@/shared/schemas/revisions';
import { sheetSchema } from '@/shared/schemas/sheet';
import { patchRow, readDraft, rowOf, type Session } from '../helpers/sheet';
import { listRevisions, post, readRevision, revisionLabelled, setUpTern } from '../revisions/tern';
import { download, openWorkbook, saveWorkbook, upload } from './workbook-files';

jest.setTimeout(60_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'lucia', 'oren']);
const { people } = tern;

/** The Parameters row of a key in an exported workbook. */
function rowNumberOf(worksheet: ExcelJS.Worksheet, key: string): number {
  let found = 0;
  worksheet.eachRow((row, number) => {
    if (row.getCell('A').text === key) found = number;
  });
  if (found === 0) throw new Error(`no row ${key} in the workbook`);
  return found;
}

function setCell(worksheet: ExcelJS.Worksheet, key: string, column: keyof typeof PARAMETER_COLUMNS, value: ExcelJS.CellValue) {
  worksheet.getCell(`${PARAMETER_COLUMNS[column].letter}${rowNumberOf(worksheet, key)}`).value = value;
}

async function exportedParameters(session: Session, revisionId: string) {
  const { bytes } = await download(session, tern.craftId, revisionId, 'xlsx');
  const workbook = await openWorkbook(bytes);
  const worksheet = workbook.getWorksheet('Parameters');
  if (!worksheet) throw new Error('no Parameters sheet');
  return { workbook, worksheet };
}

async function importCount(): Promise<number> {
  const [row] = await tern.testApp.sequelize.query<{ count: string }>('SELECT count(*) FROM imports', { type: QueryTypes.SELECT });
  return Number(row?.count);
}

const acceptPath = (importId: string) => `/api/crafts/${tern.craftId}/imports/${importId}/accept`;

describe('GET /api/crafts/:craftId/revisions/:revisionId/export.*', () => {
  it('sends the workbook as a download with a cover, live formulas over one defined name per key, and the mass budget', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { response, bytes } = await download(people.tomas, tern.craftId, draft.revision.id, 'xlsx');
    expect(response.headers['content-type']).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    expect(response.headers['content-disposition']).toBe('attachment; filename="tern-working-draft.xlsx"');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    const workbook = await openWorkbook(bytes);
    expect(workbook.worksheets.map((sheet) => sheet.name)).toEqual(['Cover', 'Parameters', 'Mass budget', 'Allowances']);
    const cover = workbook.getWorksheet('Cover');
    expect(cover?.getCell('B2').text).toBe('Tern');
    expect(cover?.getCell('B5').text).toBe('Tomás Reyes');
    expect(cover?.getCell('B10').text).toMatch(/^Preliminary sizing estimates/);
    const parameters = workbook.getWorksheet('Parameters');
    if (!parameters) throw new Error('no Parameters sheet');
    const area = rowNumberOf(parameters, 'sail_area');
    expect(parameters.getCell(`F${area}`).formula).toBe('(sail_side^2)');
    expect(parameters.getCell(`J${area}`).value).toBe(rowOf(draft, 'sail_area').version);
    const predicted = rowNumberOf(parameters, 'predicted_mass');
    expect(parameters.getCell(`F${predicted}`).formula).toMatch(/^SUM\('Mass budget'!\$H\$2:\$H\$\d+\)$/);
    const budget = workbook.getWorksheet('Mass budget');
    expect(budget?.getCell('G2').formula).toMatch(/^INDEX\(Allowances!/);
    expect(budget?.getCell('H2').formula).toBe('F2*(1+G2)');
  });

  it('writes a label, note or source that starts with = + - or @ as text, never as a formula', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const row = rowOf(draft, 'bus_mass');
    await patchRow(people.tomas, draft.path, 'bus_mass', {
      version: row.version,
      label: '=HYPERLINK("http://attacker.example","bus")',
      note: '+1+cmd|calc',
      source: '@SUM(1)',
    }).expect(200);
    const { worksheet } = await exportedParameters(people.tomas, draft.revision.id);
    const at = rowNumberOf(worksheet, 'bus_mass');
    for (const [column, text] of [
      ['B', '=HYPERLINK("http://attacker.example","bus")'],
      ['H', '+1+cmd|calc'],
      ['I', '@SUM(1)'],
    ] as const) {
      expect(worksheet.getCell(`${column}${at}`).type).toBe(3 /* exceljs ValueType.String */);
      expect(worksheet.getCell(`${column}${at}`).value).toBe(text);
    }
    const csv = (await download(people.tomas, tern.craftId, draft.revision.id, 'csv')).bytes.toString();
    expect(csv).toContain(`bus_mass,"'=HYPERLINK(""http://attacker.example"",""bus"")",Spacecraft,10,kg,`);
  });

  it('sends the sheet JSON in the documented format and the computed values as CSV', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const json = JSON.parse((await download(people.tomas, tern.craftId, draft.revision.id, 'json')).bytes.toString());
    const sheet = sheetSchema.parse(json);
    expect(sheet.parameters.map((parameter) => parameter.key)).toEqual(draft.sheet.parameters.map((parameter) => parameter.key));
    const values = evaluateSheet(sheet).values;
    const csv = (await download(people.tomas, tern.craftId, draft.revision.id, 'csv')).bytes.toString().split('\r\n');
    expect(csv[0]).toBe('key,label,subsystem,value,unit,error');
    const area = csv.find((line) => line.startsWith('sail_area,'));
    expect(area).toBe(`sail_area,Sail area,Sail membrane,${values.sail_area?.value},m^2,`);
  });

  it("gives a partner only the rows shared with them, formulas that read other rows as Trimsheet's values", async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { workbook, worksheet } = await exportedParameters(people.lucia, draft.revision.id);
    const keys: string[] = [];
    worksheet.eachRow((row, number) => {
      if (number > 1) keys.push(row.getCell('A').text);
    });
    const shared = draft.sheet.parameters.filter((row) => row.subsystem === 'Sail membrane').map((row) => row.key);
    expect(keys).toEqual(shared);
    expect(workbook.definedNames.model.map((name) => name.name).sort()).toEqual([...shared].sort());
    // The budget sheet lists her mass rows, without totals over rows she does not see.
    const budget = workbook.getWorksheet('Mass budget');
    expect(budget?.rowCount).toBe(2);
  });

  it('is 404 for a revision of another craft or none', async () => {
    await people.tomas.agent.get(`/api/crafts/${tern.craftId}/revisions/00000000-0000-4000-8000-000000000000/export.xlsx`).expect(404);
  });
});

describe('importing a workbook', () => {
  it('round trip: a partner-style edit previews each change with its cell, and accepting opens a study with exactly those', async () => {
    const draft = await readDraft(people.amara, tern.craftId);
    const { workbook, worksheet } = await exportedParameters(people.amara, draft.revision.id);
    setCell(worksheet, 'sail_side', 'value', 50);
    setCell(worksheet, 'boom_linear_density', 'unit', 'kg/m');
    setCell(worksheet, 'boom_linear_density', 'value', 0.012);
    setCell(worksheet, 'boom_length', 'formula', { formula: '(sail_side*SQRT(2)/2)*1.01' });
    setCell(worksheet, 'payload_mass', 'unit', 'furlongs');
    setCell(worksheet, 'bus_mass', 'formula', { formula: 'sail_side*2' });
    setCell(worksheet, 'trim_mass', 'formula', { formula: 'trim_mass+(' });
    worksheet.spliceRows(rowNumberOf(worksheet, 'slew_time'), 1);
    const added = worksheet.addRow(['hinge_margin', 'Hinge margin', 'Booms', 0.25, 'kg']);
    const before = await importCount();
    const response = await upload(people.amara, tern.craftId, draft.revision.id, await saveWorkbook(workbook)).expect(201);
    const preview = response.body as ImportPreview;
    expect(await importCount()).toBe(before + 1);
    expect(preview).toEqual(expect.objectContaining({ state: 'pending', revisionId: draft.revision.id, revisionLabel: 'Working draft' }));
    const changes = Object.fromEntries(preview.changed.map((row) => [row.key, row.changes]));
    expect(changes.sail_side).toEqual([{ field: 'value', from: '45 m', to: '50 m' }]);
    expect(changes.boom_linear_density).toEqual([
      { field: 'unit', from: 'g/m', to: 'kg/m' },
      { field: 'value', from: '15 g/m', to: '0.012 kg/m' },
    ]);
    expect(changes.boom_length).toEqual([{ field: 'formula', from: '=sail_side * SQRT(2) / 2', to: '=sail_side * SQRT(2) / 2 * 1.01' }]);
    expect(Object.keys(changes).sort()).toEqual(['boom_length', 'boom_linear_density', 'sail_side']);
    expect(preview.added).toEqual([
      { key: 'hinge_margin', label: 'Hinge margin', subsystem: 'Booms', cell: `Parameters!A${added.number}`, definition: '0.25 kg' },
    ]);
    expect(preview.removed).toEqual([expect.objectContaining({ key: 'slew_time' })]);
    const problems = Object.fromEntries(preview.problems.map((problem) => [problem.key, problem]));
    expect(problems.payload_mass).toEqual(
      expect.objectContaining({ code: 'unknown_unit', cell: `Parameters!E${rowNumberOf(worksheet, 'payload_mass')}` }),
    );
    expect(problems.bus_mass).toEqual(
      expect.objectContaining({ code: 'dimension_mismatch', cell: `Parameters!F${rowNumberOf(worksheet, 'bus_mass')}` }),
    );
    expect(problems.trim_mass).toEqual(
      expect.objectContaining({ code: 'formula_unreadable', cell: `Parameters!F${rowNumberOf(worksheet, 'trim_mass')}` }),
    );
    expect(preview.ignored).toEqual([]);

    const accepted = await post(people.amara, acceptPath(preview.id), { name: 'Partner workbook' }).expect(201);
    expect(accepted.body).toEqual(expect.objectContaining({ kind: 'study', label: 'Partner workbook', parentId: draft.revision.id }));
    const study = await readRevision(people.amara, tern.craftId, accepted.body.id as string);
    const expected = draft.sheet.parameters
      .filter((row) => row.key !== 'slew_time')
      .map((row) => {
        if (row.key === 'sail_side') return { ...row, value: 50 };
        if (row.key === 'boom_linear_density') return { ...row, value: 0.012, unit: 'kg/m' };
        if (row.key === 'boom_length') return { ...row, formula: '=sail_side * SQRT(2) / 2 * 1.01' };
        return row;
      });
    const content = (detail: RevisionDetail | { sheet: { parameters: typeof expected } }) =>
      detail.sheet.parameters.map(({ version: _v, updatedAt: _a, updatedBy: _b, subsystemId: _s, ...rest }) => rest);
    const studyRows = content(study);
    expect(studyRows.filter((row) => row.key !== 'hinge_margin')).toEqual(content({ sheet: { parameters: expected } }));
    // Added after the row before it in the file: the last one.
    expect(studyRows.at(-1)?.key).toBe('hinge_margin');
    // The draft itself did not change.
    expect(content(await readDraft(people.amara, tern.craftId))).toEqual(content(draft));

    const again = await post(people.amara, acceptPath(preview.id), {}).expect(409);
    expect(again.body.error.code).toBe('already_accepted');
  });

  it('reads an untouched export as no change at all', async () => {
    const pdr = await revisionLabelled(people.tomas, tern.craftId, 'PDR');
    const { bytes } = await download(people.tomas, tern.craftId, pdr.id, 'xlsx');
    const preview = (await upload(people.tomas, tern.craftId, pdr.id, bytes).expect(201)).body as ImportPreview;
    expect(preview).toEqual(expect.objectContaining({ changed: [], added: [], removed: [], problems: [], ignored: [] }));
  });

  it('lets a partner change only the rows shared with them; others are listed as ignored with the reason', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { workbook, worksheet } = await exportedParameters(people.lucia, draft.revision.id);
    setCell(worksheet, 'film_thickness', 'value', 2);
    worksheet.addRow(['boom_hinge_mass', 'Boom hinge', 'Booms', 0.3, 'kg']);
    const preview = (await upload(people.lucia, tern.craftId, draft.revision.id, await saveWorkbook(workbook)).expect(201))
      .body as ImportPreview;
    expect(preview.changed.map((row) => row.key)).toEqual(['film_thickness']);
    expect(preview.removed).toEqual([]);
    expect(preview.ignored).toEqual([
      expect.objectContaining({ key: 'boom_hinge_mass', reason: 'Rows of "Booms" are not shared with you' }),
    ]);
    const study = (await post(people.lucia, acceptPath(preview.id), {}).expect(201)).body as { id: string; label: string };
    expect(study.label).toBe('Import of partner.xlsx');
    const detail = await readRevision(people.tomas, tern.craftId, study.id);
    expect(rowOf(detail, 'film_thickness').value).toBe(2);
    expect(detail.sheet.parameters.some((row) => row.key === 'boom_hinge_mass')).toBe(false);
    expect(detail.sheet.parameters).toHaveLength(draft.sheet.parameters.length);
  });

  it('refuses to accept when a row the preview changes moved on in the revision since, and writes nothing', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { workbook, worksheet } = await exportedParameters(people.tomas, draft.revision.id);
    setCell(worksheet, 'cp_offset', 'value', 0.03);
    const preview = (await upload(people.tomas, tern.craftId, draft.revision.id, await saveWorkbook(workbook)).expect(201))
      .body as ImportPreview;
    const row = rowOf(await readDraft(people.amara, tern.craftId), 'cp_offset');
    await patchRow(people.amara, draft.path, 'cp_offset', { version: row.version, value: 0.025 }).expect(200);
    const studies = (await listRevisions(people.tomas, tern.craftId)).length;
    const refused = await post(people.tomas, acceptPath(preview.id), {}).expect(409);
    expect(refused.body.error).toEqual(expect.objectContaining({ code: 'import_stale', details: { keys: ['cp_offset'] } }));
    expect(await listRevisions(people.tomas, tern.craftId)).toHaveLength(studies);
    // The file itself is now stale for that row: a new preview says so, naming the version cell.
    const again = (await upload(people.tomas, tern.craftId, draft.revision.id, await saveWorkbook(workbook)).expect(201))
      .body as ImportPreview;
    expect(again.changed).toEqual([]);
    expect(again.problems).toEqual([
      expect.objectContaining({ key: 'cp_offset', code: 'stale_row', cell: `Parameters!J${rowNumberOf(worksheet, 'cp_offset')}` }),
    ]);
  });

  it('keeps a preview to its importer and refuses an expired one with 410', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { bytes } = await download(people.tomas, tern.craftId, draft.revision.id, 'xlsx');
    const preview = (await upload(people.tomas, tern.craftId, draft.revision.id, bytes).expect(201)).body as ImportPreview;
    await post(people.amara, acceptPath(preview.id), {}).expect(404);
    await tern.testApp.sequelize.query(`UPDATE imports SET expires_at = now() - interval '1 minute' WHERE id = $1`, { bind: [preview.id] });
    const expired = await post(people.tomas, acceptPath(preview.id), {}).expect(410);
    expect(expired.body.error.code).toBe('import_expired');
  });

  it('refuses viewers with 403 before reading the upload', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { bytes } = await download(people.oren, tern.craftId, draft.revision.id, 'xlsx');
    const before = await importCount();
    await upload(people.oren, tern.craftId, draft.revision.id, bytes).expect(403);
    expect(await importCount()).toBe(before);
  });
});
