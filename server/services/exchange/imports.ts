import ExcelJS from 'exceljs';
import type { Sequelize } from 'sequelize';
import { mayOnRow, whyNotOnRow } from '@/shared/access/permissions';
import { previewImport, applySteps, type FileRow, type ReadCell } from '@/shared/exchange/import-preview';
import {
  FIRST_DATA_ROW,
  MASS_BUDGET_FIRST_ROW,
  MASS_BUDGET_SHEET,
  PARAMETERS_SHEET,
  PARAMETER_COLUMNS,
  PARAMETER_COLUMN_ORDER,
  type ParameterColumn,
} from '@/shared/exchange/layout';
import { foreignFunction, refersToOtherFile } from '@/shared/exchange/spreadsheet-formulas';
import type { AcceptImportBody, ImportPreview, ImportStep } from '@/shared/schemas/exchange';
import type { Revision as RevisionDto } from '@/shared/schemas/revisions';
import { HttpError, notFound } from '../../http-error';
import type { Upload } from '../../middleware/upload';
import { Import, type User } from '../../models';
import {
  deleteRow,
  insertRows,
  recordChanges,
  selectRows,
  setOrder,
  toParameter,
  updateRow,
  type RowChange,
} from '../../models/sheet-rows';
import { authorizeCraft } from '../craft-access';
import { introducedError } from '../parameters';
import { readRevision } from '../revisions';
import { selectRevision, selectSubsystems, sheetHeaderOf, toRevisionDto } from '../sheet-store';
import { openStudyIn } from '../studies';
import { guardWorkbook, refuseContainer } from './workbook-guard';

/** How long a preview may be accepted. */
const PREVIEW_HOURS = 24;

/** A cell as exceljs reads it, in the few kinds the preview knows. */
function readCell(cell: ExcelJS.Cell): ReadCell {
  const value = cell.value;
  if (value === null || value === undefined) return { kind: 'empty' };
  if (typeof value === 'number') return { kind: 'number', value };
  if (typeof value === 'string') return value.trim() === '' ? { kind: 'empty' } : { kind: 'text', text: value };
  if (typeof value === 'boolean') return { kind: 'text', text: String(value) };
  if (value instanceof Date) return { kind: 'text', text: value.toISOString() };
  if ('formula' in value || 'sharedFormula' in value) return { kind: 'formula', formula: cell.formula };
  if ('richText' in value) return { kind: 'text', text: value.richText.map((run) => run.text).join('') };
  if ('text' in value) return { kind: 'text', text: String(value.text) };
  if ('error' in value) return { kind: 'text', text: String(value.error) };
  return { kind: 'empty' };
}

async function loadWorkbook(bytes: Buffer): Promise<ExcelJS.Workbook> {
  const workbook = new ExcelJS.Workbook();
  try {
    // exceljs's types ask for its own Buffer type; a Node Buffer is what it reads.
    await workbook.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  } catch (error) {
    throw new HttpError(
      400,
      'malformed_workbook',
      `The workbook cannot be read: ${error instanceof Error ? error.message : String(error)}`,
    );
  }
  return workbook;
}

/** Refuses formulas that reach outside the workbook or call functions Trimsheet does not know, naming the cell. */
function refuseForeignFormulas(workbook: ExcelJS.Workbook): void {
  workbook.eachSheet((worksheet) => {
    worksheet.eachRow((row) => {
      row.eachCell((cell) => {
        if (cell.type !== ExcelJS.ValueType.Formula) return;
        const formula = cell.formula;
        const where = `${worksheet.name}!${cell.address}`;
        if (refersToOtherFile(formula)) {
          throw new HttpError(
            400,
            'external_reference',
            `The formula in ${where} refers to another file; formulas may only name parameter keys`,
          );
        }
        const foreign = foreignFunction(formula);
        if (foreign !== undefined) {
          throw new HttpError(400, 'unknown_function', `The formula in ${where} calls ${foreign}, which Trimsheet does not know`);
        }
      });
    });
  });
}

/** The Parameters sheet's rows, after checking that its header is Trimsheet's. */
function parameterRows(workbook: ExcelJS.Workbook): FileRow[] {
  const worksheet = workbook.getWorksheet(PARAMETERS_SHEET);
  if (worksheet === undefined) {
    throw new HttpError(
      400,
      'not_trimsheet_layout',
      `The workbook has no "${PARAMETERS_SHEET}" sheet: export a revision from Trimsheet and edit that file`,
    );
  }
  const header = worksheet.getRow(1);
  for (const column of PARAMETER_COLUMN_ORDER) {
    const { letter, header: expected } = PARAMETER_COLUMNS[column];
    const found = header.getCell(letter).text.trim();
    if (found !== expected) {
      throw new HttpError(
        400,
        'not_trimsheet_layout',
        `${PARAMETERS_SHEET}!${letter}1 should read "${expected}" (found "${found}"): keep Trimsheet's columns in their places`,
      );
    }
  }
  const rows: FileRow[] = [];
  for (let number = FIRST_DATA_ROW; number <= worksheet.rowCount; number += 1) {
    const row = worksheet.getRow(number);
    const cells = Object.fromEntries(
      PARAMETER_COLUMN_ORDER.map((column) => [column, readCell(row.getCell(PARAMETER_COLUMNS[column].letter))]),
    ) as Record<ParameterColumn, ReadCell>;
    rows.push({ row: number, cells });
  }
  return rows;
}

/** The key on each line of the mass-budget sheet, by row number. */
function budgetKeys(workbook: ExcelJS.Workbook): Map<number, string> {
  const keys = new Map<number, string>();
  const worksheet = workbook.getWorksheet(MASS_BUDGET_SHEET);
  worksheet?.eachRow((row, number) => {
    if (number >= MASS_BUDGET_FIRST_ROW) keys.set(number, row.getCell(1).text.trim());
  });
  return keys;
}

function previewDto(record: Import, revisionLabel: string): ImportPreview {
  return {
    id: record.id,
    craftId: record.craftId,
    revisionId: record.revisionId,
    revisionLabel,
    fileName: record.fileName,
    state: record.state,
    createdAt: record.createdAt.toISOString(),
    expiresAt: record.expiresAt.toISOString(),
    studyId: record.studyId ?? null,
    ...record.preview,
  };
}

/** Whether the person may import workbooks into the craft at all (before the upload is read): 404, 403. */
export async function authorizeImport(user: User, craftId: string): Promise<void> {
  await authorizeCraft(user, craftId, 'importWorkbook');
}

/**
 * Reads an uploaded workbook against a revision and stores its preview: nothing of the sheet is written. The file
 * is checked before it is parsed (see workbook-guard); formulas reaching other files or calling unknown functions
 * are refused, naming the cell. Rows the importer may not change are listed as ignored, with the reason.
 */
export async function createImport(user: User, craftId: string, revisionId: string, upload: Upload): Promise<ImportPreview> {
  await authorizeImport(user, craftId);
  const readable = await readRevision(user, craftId, revisionId);
  refuseContainer(upload.type.mime, upload.name);
  await guardWorkbook(upload.bytes);
  const workbook = await loadWorkbook(upload.bytes);
  refuseForeignFormulas(workbook);
  const fileRows = parameterRows(workbook);
  const keyAtRow = budgetKeys(workbook);
  const { who, standing, revision } = readable;
  const outcome = previewImport(fileRows, {
    header: sheetHeaderOf(revision),
    rows: readable.rows(),
    subsystems: revision.subsystems ?? [],
    mayView: (row) => mayOnRow('viewRow', who, row, standing),
    whyNotImport: (subsystem) => whyNotOnRow('importRow', who, { subsystemId: subsystem.id, subsystemName: subsystem.name }, standing),
    keyAtBudgetRow: (row) => keyAtRow.get(row),
  });
  const record = await Import.create({
    craftId,
    revisionId,
    createdById: user.id,
    fileName: upload.name,
    preview: outcome.preview,
    steps: outcome.steps,
    expiresAt: new Date(Date.now() + PREVIEW_HOURS * 3600_000),
  });
  return previewDto(record, revision.label);
}

/**
 * Accepts a preview: one transaction opens a study of the revision the workbook was read against, as that revision
 * is now, and applies the preview's steps to it (history entries by the importer). Only the importer, once, before
 * it expires: 404 for anyone else, 409 already_accepted, 410 import_expired. When a row the preview changes has
 * moved on in the revision since (another version, or a new row's key now taken), nothing is written: 409
 * import_stale naming the rows (upload the file again); changes elsewhere in the revision do not matter.
 */
export async function acceptImport(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  importId: string,
  body: AcceptImportBody,
): Promise<RevisionDto> {
  const { craft } = await authorizeCraft(user, craftId, 'importWorkbook');
  return sequelize.transaction(async (transaction) => {
    const record = await Import.findOne({
      where: { id: importId, craftId, createdById: user.id },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (record === null) throw notFound('Import');
    if (record.state === 'accepted') {
      throw new HttpError(409, 'already_accepted', 'This import was accepted already; it opened a study', { studyId: record.studyId });
    }
    if (record.expiresAt.getTime() < Date.now()) {
      throw new HttpError(410, 'import_expired', `This preview expired (previews last ${PREVIEW_HOURS} hours); import the file again`);
    }
    const source = await selectRevision(sequelize, craftId, record.revisionId, { transaction, lock: true });
    const sourceRows = await selectRows(sequelize, source.id, transaction);
    const steps = record.steps;
    refuseStaleSteps(steps, new Map(sourceRows.map((row) => [row.key, row.version])));
    const header = sheetHeaderOf(source);
    const before = { ...header, parameters: sourceRows.map(toParameter) };
    const after = applySteps(before, steps);
    const broken = introducedError(before, after);
    if (broken) {
      throw new HttpError(
        409,
        'import_breaks_sheet',
        `The revision changed since the preview, and the import would now break it: ${broken.message}`,
        {
          key: broken.key,
          code: broken.code,
        },
      );
    }
    const name = body.name ?? `Import of ${record.fileName}`.slice(0, 100);
    const studyId = await openStudyIn(sequelize, transaction, user, craft, source, { name, note: body.note });
    const studyRows = new Map((await selectRows(sequelize, studyId, transaction)).map((row) => [row.key, row]));
    const subsystemIds = new Map(
      (await selectSubsystems(sequelize, craftId, transaction)).map((subsystem) => [subsystem.name, subsystem.id]),
    );
    const changes: RowChange[] = [];
    const subsystemOf = (subsystem: string) => {
      const id = subsystemIds.get(subsystem);
      if (id === undefined)
        throw new HttpError(409, 'import_stale', `The subsystem "${subsystem}" is gone since the preview; import the file again`);
      return id;
    };
    const created = [];
    for (const step of steps) {
      if (step.action === 'create') {
        created.push({ parameter: step.parameter, subsystemId: subsystemOf(step.parameter.subsystem), position: 0 });
        changes.push({ key: step.parameter.key, action: 'create', before: null, after: { ...step.parameter, version: 1 } });
        continue;
      }
      const row = studyRows.get(step.key);
      if (row === undefined) continue;
      const previous = { ...toParameter(row), version: row.version };
      if (step.action === 'delete') {
        await deleteRow(sequelize, row.id, transaction);
        changes.push({ key: step.key, action: 'delete', before: previous, after: null });
      } else {
        const content = { parameter: step.parameter, subsystemId: subsystemOf(step.parameter.subsystem), position: row.position };
        await updateRow(sequelize, row.id, row.version, content, user.id, transaction);
        changes.push({ key: step.key, action: 'update', before: previous, after: { ...step.parameter, version: row.version + 1 } });
      }
    }
    await insertRows(sequelize, studyId, created, user.id, transaction);
    await setOrder(
      sequelize,
      studyId,
      after.parameters.map((parameter) => parameter.key),
      transaction,
    );
    await recordChanges(sequelize, studyId, changes, user.id, transaction);
    await record.update({ state: 'accepted', studyId, acceptedAt: new Date() }, { transaction });
    return toRevisionDto(await selectRevision(sequelize, craftId, studyId, { transaction }));
  });
}

/** 409 import_stale when a row a step changes or removes is at another version now, or a new row's key is taken. */
function refuseStaleSteps(steps: readonly ImportStep[], versions: ReadonlyMap<string, number>): void {
  const stale = steps.flatMap((step) => {
    if (step.action === 'create') return versions.has(step.parameter.key) ? [step.parameter.key] : [];
    return versions.get(step.key) === step.version ? [] : [step.key];
  });
  if (stale.length > 0) {
    throw new HttpError(
      409,
      'import_stale',
      `Rows changed in the revision since the preview: ${stale.join(', ')}; import the file again to see the changes against them`,
      { keys: stale },
    );
  }
}
