import ExcelJS from 'exceljs';
import { evaluateSheet } from '@/shared/engine';
import { quotedSheet } from '@/shared/exchange/layout';
import { valuesTable } from '@/shared/exchange/values-table';
import { buildWorkbookLayout, type WorkbookLayout } from '@/shared/exchange/workbook-layout';
import type { ExportFormat } from '@/shared/schemas/exchange';
import type { RevisionParameter } from '@/shared/schemas/revisions';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import type { User } from '../../models';
import { csvCell } from '../audit';
import { readRevision } from '../revisions';

/** A file to send: its bytes, media type and name. */
export interface ExportFile {
  body: Buffer;
  type: string;
  fileName: string;
}

const MEDIA_TYPES: Readonly<Record<ExportFormat, string>> = {
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  json: 'application/json; charset=utf-8',
  csv: 'text/csv; charset=utf-8',
};

/** A row in the sheet format (no version, ids or editor). */
function parameterOf(row: RevisionParameter): Parameter {
  const { version: _version, subsystemId: _subsystemId, updatedBy: _updatedBy, updatedAt: _updatedAt, ...parameter } = row;
  return parameter;
}

/** Writes the layout with exceljs: no cached results, and a full recalculation asked for when the file is opened. */
export async function renderWorkbook(layout: WorkbookLayout): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Trimsheet';
  workbook.calcProperties.fullCalcOnLoad = true;
  for (const sheet of layout.sheets) {
    const worksheet = workbook.addWorksheet(sheet.name, {
      views: sheet.frozenRows > 0 ? [{ state: 'frozen', ySplit: sheet.frozenRows }] : [],
    });
    worksheet.columns = sheet.widths.map((width) => ({ width }));
    worksheet.addRows(
      sheet.rows.map((cells) => cells.map((cell) => (cell !== null && typeof cell === 'object' ? { formula: cell.formula } : cell))),
    );
  }
  // exceljs keeps each defined name as a matrix of cells, which costs it the row number of the cell in time and
  // memory per name (seconds for thousands of rows); its writer only reads the list of names and ranges, so the
  // list is given to it as is.
  const definedNames = layout.names.map(({ name, sheet, cell }) => ({ name, ranges: [`${quotedSheet(sheet)}!${cell}`] }));
  Object.defineProperty(workbook, '_definedNames', { value: { model: definedNames } });
  // Inline strings, no style sheet and light compression: the same cells, written in half the time.
  return Buffer.from(
    await workbook.xlsx.writeBuffer({ useStyles: false, useSharedStrings: false, zip: { compressionOptions: { level: 1 } } }),
  );
}

/** "tern-working-draft" from a craft's and a revision's names. */
function fileStem(craftName: string, revisionLabel: string): string {
  const slug = (text: string) =>
    text
      .normalize('NFKD')
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .toLowerCase();
  return [slug(craftName), slug(revisionLabel)].filter(Boolean).join('-') || 'revision';
}

/**
 * A revision as a workbook (live formulas over one defined name per key), as the sheet JSON (the documented
 * format, which `npm run evaluate` reads) or as CSV of the computed values. Whoever views the craft; a partner
 * gets the rows shared with them (formulas reading other rows carry Trimsheet's value). 404 as for the revision.
 */
export async function exportRevision(user: User, craftId: string, revisionId: string, format: ExportFormat): Promise<ExportFile> {
  const readable = await readRevision(user, craftId, revisionId);
  const { revision, who } = readable;
  const sheet = readable.sheet();
  const visible = readable.visibleRows();
  const fileName = `${fileStem(who.craft.name, revision.label)}.${format}`;
  const file = (body: Buffer): ExportFile => ({ body, type: MEDIA_TYPES[format], fileName });
  if (format === 'json') {
    const shared: Sheet = { ...sheet, parameters: visible.map(parameterOf) };
    return file(Buffer.from(`${JSON.stringify(shared, null, 2)}\n`));
  }
  if (format === 'csv') {
    const table = valuesTable(visible.map(parameterOf), evaluateSheet(sheet));
    return file(Buffer.from(`${table.map((cells) => cells.map(csvCell).join(',')).join('\r\n')}\r\n`));
  }
  const layout = buildWorkbookLayout({
    craftName: who.craft.name,
    revision: { label: revision.label, kind: revision.kind, state: revision.state },
    exportedBy: user.name,
    exportedAt: new Date().toISOString(),
    sheet,
    versions: new Map(readable.rows().map((row) => [row.key, row.version])),
    ...(readable.seesEveryRow ? {} : { visibleKeys: new Set(visible.map((row) => row.key)), evaluation: evaluateSheet(sheet) }),
  });
  return file(await renderWorkbook(layout));
}
