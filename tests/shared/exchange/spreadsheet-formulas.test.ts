import { parseFormula } from '@/shared/engine/formula-parser';
import {
  foreignFunction,
  fromSpreadsheetFormula,
  printFormula,
  refersToOtherFile,
  sameFormula,
  toSpreadsheetFormula,
  type MassBudgetPlaces,
} from '@/shared/exchange/spreadsheet-formulas';
import { squareSailTemplate } from '@/shared/templates';

const template = squareSailTemplate();
const massKeys = template.parameters.filter((parameter) => parameter.mass !== undefined).map((parameter) => parameter.key);
const places: MassBudgetPlaces = {
  rowOf: (key) => (massKeys.includes(key) ? massKeys.indexOf(key) + 2 : undefined),
  lastRow: massKeys.length + 1,
};
const keyAtBudgetRow = (row: number) => massKeys[row - 2];
const formulas = [
  ...template.parameters.flatMap((parameter) => (parameter.formula === undefined ? [] : [parameter.formula])),
  '=PREDICTED(boom_mass) / 2',
  '=-2^2 + 5%',
  '=IF(sail_side > 10, 1, 0) * (sail_side <= 40)',
  '=a - (b - c) / (d / e) ^ f ^ g',
];

describe('spreadsheet formulas', () => {
  it.each(formulas)('writes %s for a spreadsheet and reads it back as the same tree', (formula) => {
    const tree = parseFormula(formula);
    const read = fromSpreadsheetFormula(toSpreadsheetFormula(tree, places), keyAtBudgetRow);
    if (!read.ok) throw new Error(read.message);
    expect(sameFormula(read.value, tree)).toBe(true);
  });

  it.each(formulas)('prints %s with only the brackets it needs, parsing to the same tree', (formula) => {
    expect(sameFormula(parseFormula(printFormula(parseFormula(formula))), parseFormula(formula))).toBe(true);
  });

  it('writes our functions as plain arithmetic over the mass-budget sheet', () => {
    expect(toSpreadsheetFormula(parseFormula('=PREDICTED(boom_mass)'), places)).toBe(
      `(boom_mass*(1+'Mass budget'!$G$${massKeys.indexOf('boom_mass') + 2}))`,
    );
    expect(toSpreadsheetFormula(parseFormula('=TOTAL_CBE()'), places)).toBe(`SUM('Mass budget'!$F$2:$F$${massKeys.length + 1})`);
    expect(toSpreadsheetFormula(parseFormula('=a >= b'), places)).toBe('IF((a>=b),1,0)');
  });

  it('refuses references to cells and allowance cells of another row', () => {
    expect(fromSpreadsheetFormula('=D7*2', keyAtBudgetRow)).toEqual({
      ok: false,
      message: 'it refers to the cell D7; name parameter keys instead',
    });
    expect(fromSpreadsheetFormula('=Parameters!$K$3', keyAtBudgetRow).ok).toBe(false);
    expect(fromSpreadsheetFormula("=bus_mass*(1+'Mass budget'!$G$2)", keyAtBudgetRow).ok).toBe(massKeys[0] === 'bus_mass');
  });

  it('finds functions and links a workbook must not carry', () => {
    expect(foreignFunction('SQRT(a)+WEBSERVICE("http://x")')).toBe('WEBSERVICE');
    expect(foreignFunction('_xlfn.INDEX(A1:B2,MATCH("SQRT(",A1:A2,0),1)')).toBeUndefined();
    expect(refersToOtherFile('[1]Prices!A1*2')).toBe(true);
    expect(refersToOtherFile('cmd|calc!A0')).toBe(true);
    expect(refersToOtherFile('a*"[not a link]"')).toBe(false);
  });
});
