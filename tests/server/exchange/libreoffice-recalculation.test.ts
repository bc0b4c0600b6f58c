import type ExcelJS from 'exceljs';
import { sheetMassBudget } from '@/shared/analyses';
import { evaluateSheet, parseUnit, toSI } from '@/shared/engine';
import { MASS_BUDGET_FIRST_ROW, PARAMETER_COLUMNS } from '@/shared/exchange/layout';
import { massBudgetSummaryRows } from '@/shared/exchange/workbook-layout';
import { sheetSchema } from '@/shared/schemas/sheet';
import { readDraft } from '../helpers/sheet';
import { post, setUpTern } from '../revisions/tern';
import { recalculateWithLibreOffice } from './libreoffice';
import { download, openWorkbook } from './workbook-files';

jest.setTimeout(180_000);

/**
 * The exported workbook, recalculated by a real spreadsheet program (LibreOffice Calc, headless, every formula
 * recalculated on load), gives Trimsheet's values: every computed cell of the Parameters and Mass budget sheets
 * agrees with the shared engine's evaluation to a relative 1e-9.
 */
const tern = setUpTern(['tomas']);

/** A number LibreOffice computed into a formula cell; fails on text, errors and empty cells. */
function computed(worksheet: ExcelJS.Worksheet, address: string): number {
  const cell = worksheet.getCell(address);
  const value = cell.type === 6 /* exceljs ValueType.Formula */ ? cell.result : cell.value;
  if (typeof value !== 'number') throw new Error(`${worksheet.name}!${address} holds ${JSON.stringify(value)}, not a number`);
  return value;
}

function expectClose(actual: number, expected: number, where: string) {
  const scale = Math.max(Math.abs(expected), Number.MIN_VALUE);
  expect({ where, relativeError: Math.abs(actual - expected) / scale <= 1e-9 ? 'within 1e-9' : { actual, expected } }).toEqual({
    where,
    relativeError: 'within 1e-9',
  });
}

it("recalculates in LibreOffice Calc to Trimsheet's values, cell by cell", async () => {
  const person = tern.people.tomas;
  const draft = await readDraft(person, tern.craftId);
  // Rows that exercise what the translation must get right: an offset unit, percent, a comparison, PREDICTED.
  const extra = [
    { key: 'radiator_temperature', label: 'Radiator temperature', subsystem: 'Optics', unit: 'degC', value: 85 },
    { key: 'radiator_kelvin', label: 'Radiator (K)', subsystem: 'Optics', unit: 'K', formula: '=radiator_temperature * 2' },
    { key: 'margin_is_enough', label: 'Margin is enough', subsystem: 'Mass budget', unit: '', formula: '=system_margin_percent >= 15%' },
    { key: 'boom_mass_predicted', label: 'Boom mass, predicted', subsystem: 'Booms', unit: 'g', formula: '=PREDICTED(boom_mass)' },
    { key: 'tilt', label: 'Tilt', subsystem: 'Optics', unit: 'deg', formula: '=ATAN2(1, -2) + 5%*radian' },
  ];
  for (const parameter of extra) {
    const created = await post(person, `${draft.path}/parameters`, { parameter });
    expect({ key: parameter.key, status: created.status, error: created.body.error }).toEqual({ key: parameter.key, status: 201 });
  }

  const { bytes } = await download(person, tern.craftId, draft.revision.id, 'xlsx');
  const sheet = sheetSchema.parse(JSON.parse((await download(person, tern.craftId, draft.revision.id, 'json')).bytes.toString()));
  const evaluation = evaluateSheet(sheet);
  const budget = sheetMassBudget(sheet, evaluation);
  if (!budget.ok) throw new Error(`the budget does not roll up: ${JSON.stringify(budget.errors)}`);

  const workbook = await openWorkbook(await recalculateWithLibreOffice(bytes));
  const parameters = workbook.getWorksheet('Parameters');
  const massBudget = workbook.getWorksheet('Mass budget');
  if (!parameters || !massBudget) throw new Error('the recalculated workbook lost a sheet');

  let compared = 0;
  sheet.parameters.forEach((parameter, index) => {
    const row = index + 2;
    const value = evaluation.values[parameter.key];
    const unit = parseUnit(parameter.unit);
    if (value === undefined || !unit.ok) throw new Error(`${parameter.key} has no value in Trimsheet`);
    expect(parameters.getCell(`${PARAMETER_COLUMNS.key.letter}${row}`).text).toBe(parameter.key);
    expectClose(computed(parameters, `${PARAMETER_COLUMNS.computed.letter}${row}`), value.value, `${parameter.key} computed value`);
    expectClose(computed(parameters, `${PARAMETER_COLUMNS.si.letter}${row}`), toSI(value.value, unit.value), `${parameter.key} SI value`);
    compared += 2;
  });
  budget.result.rows.forEach((line, index) => {
    const row = MASS_BUDGET_FIRST_ROW + index;
    expect(massBudget.getCell(`A${row}`).text).toBe(line.key);
    expectClose(computed(massBudget, `F${row}`), line.cbe, `${line.key} CBE`);
    expectClose(computed(massBudget, `G${row}`), line.allowance, `${line.key} allowance`);
    expectClose(computed(massBudget, `H${row}`), line.predicted, `${line.key} predicted`);
    compared += 3;
  });
  const summary = massBudgetSummaryRows(budget.result.rows.length);
  expectClose(computed(massBudget, `F${summary.total}`), budget.result.total.cbe, 'total CBE');
  expectClose(computed(massBudget, `H${summary.total}`), budget.result.total.predicted, 'total predicted');
  expectClose(computed(massBudget, `H${summary.marginKg}`), budget.result.systemMargin.kg, 'system margin (kg)');
  expectClose(computed(massBudget, `H${summary.marginPercent}`), budget.result.systemMargin.percentOfAllocation, 'system margin (%)');
  expect(compared).toBe(sheet.parameters.length * 2 + budget.result.rows.length * 3);
  // The comparison row really is 1 or 0 in both.
  expect(evaluation.values.margin_is_enough?.value).toBe(
    computed(parameters, `G${sheet.parameters.findIndex((p) => p.key === 'margin_is_enough') + 2}`),
  );
});
