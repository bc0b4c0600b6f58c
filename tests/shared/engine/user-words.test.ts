import { CellError, DetailedCellError, ErrorType } from 'hyperformula';
import { createSheetSession } from '@/shared/engine';
import { gridError } from '@/shared/engine/errors';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { readCell } from '@/shared/engine/hyperformula-cells';
import { parseQuantity, parseUnit } from '@/shared/engine/units';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { parameterKeyProblem } from '@/shared/schemas/sheet';
import { borrowedWordsIn } from '../helpers/borrowed-words';

function row(key: string, unit: string, entry: number | string, extra: Partial<Parameter> = {}): Parameter {
  const base = { key, label: key, subsystem: 'test', unit, ...extra };
  return typeof entry === 'number' ? { ...base, value: entry } : { ...base, formula: entry };
}

/** A sheet with one row of every kind of mistake people make, and the rows that depend on them. */
const badSheet: Sheet = {
  name: 'mistakes',
  budget: { preset: 'no-such-preset' },
  parameters: [
    row('side', 'm', 40),
    row('furlongs', 'furlongz', 3),
    row('prefixed', 'mdeg', 3),
    row('bracket', '(m s', 3),
    row('syntax', 'm', '=side +* 2'),
    row('unknown_ref', 'm', '=nowhere * 2'),
    row('unknown_fn', 'm', '=FROB(side)'),
    row('arity', 'm', '=SQRT(side, side)'),
    row('mismatch', 'kg', '=side * 2'),
    row('adding', 'm', '=side + 1'),
    row('zero', 'm', '=side / 0'),
    row('negative_root', '', '=SQRT(-1)'),
    row('log_negative', '', '=LN(-1)'),
    row('overflow', '', '=EXP(1000)'),
    row('cycle_a', 'm', '=cycle_b'),
    row('cycle_b', 'm', '=cycle_a'),
    row('depends', 'm', '=zero * 2'),
    row('boom2', 'm', 1),
    row('rc', 'm', 1),
    row('mass_row', 'kg', 1, { mass: { maturity: 'nowhere', category: 'nothing' } }),
    row('predicted', 'kg', '=PREDICTED(mass_row)'),
    row('text', 'm', '="forty"'),
    { key: 'film', label: 'film', subsystem: 'test', unit: 'kg/m^3', material: { id: 'unobtainium', property: 'density' } },
  ],
};

function expectOurOwnWords(messages: readonly string[]) {
  expect(messages.length).toBeGreaterThan(0);
  const offending = messages.flatMap((message) => borrowedWordsIn(message).map((word) => `${word} in: ${message}`));
  expect(offending).toEqual([]);
}

describe('the words of engine errors', () => {
  beforeEach(() => jest.spyOn(console, 'warn').mockImplementation(() => undefined));
  afterEach(() => jest.restoreAllMocks());

  it('says every mistake of a bad sheet in our own words', () => {
    const evaluation = evaluateSheet(badSheet);
    // One error per bad row (and its dependants): the sheet above makes each kind of mistake at least once.
    expect(new Set(evaluation.errors.map((error) => error.code))).toEqual(
      new Set([
        'unknown_unit',
        'syntax_error',
        'unknown_key',
        'unknown_function',
        'wrong_argument_count',
        'dimension_mismatch',
        'division_by_zero',
        'invalid_value',
        'cycle',
        'dependency_error',
        'invalid_key',
        'budget_error',
        'unknown_material',
      ]),
    );
    expectOurOwnWords(evaluation.errors.map((error) => error.message));
  });

  it('says refused edits of a live session in our own words', () => {
    const session = createSheetSession({ name: 'live', parameters: [row('side', 'm', 40), row('area', 'm^2', '=side^2')] });
    try {
      const refusals = ['25 kg', '25 furlongz', 'forty', '3 m/'].flatMap((entry) => {
        const result = session.setInput('side', entry);
        return result.ok ? [] : [result.error.message];
      });
      expect(refusals).toHaveLength(4);
      // A bad formula is kept and shown as the row's error.
      const rowErrors = ['=side +', '=NOPE(side)', '=side'].flatMap((formula) => {
        const result = session.setFormula('area', formula);
        return [...(result.ok ? [] : [result.error.message]), ...session.errors().map((error) => error.message)];
      });
      expect(rowErrors.length).toBeGreaterThanOrEqual(3);
      expectOurOwnWords([...refusals, ...rowErrors]);
    } finally {
      session.destroy();
    }
  });

  it('says unit and key refusals in our own words', () => {
    const messages = [
      ...['furlongz', 'kkg', 'mdeg', 'm^x', 'm)', '(m', 'm/', '*', 'Unit', 'mile'].map((text) => {
        const parsed = parseUnit(text);
        return parsed.ok ? '' : parsed.message;
      }),
      ...['abc', '3 parsec-ish'].map((text) => {
        const parsed = parseQuantity(text);
        return parsed.ok ? '' : parsed.message;
      }),
      ...['boom2', 'r1c1', 'rc', 'Sail', 'true'].map((key) => parameterKeyProblem(key) ?? ''),
    ];
    expect(messages.filter((message) => message === '')).toEqual([]);
    expectOurOwnWords(messages);
  });

  // Every kind of cell error the grid engine has, with its own message: ours is said, its own is only logged.
  it.each(Object.values(ErrorType))('maps the grid engine error %s to our code and words, logging its own', (type) => {
    const warn = jest.spyOn(console, 'warn').mockImplementation(() => undefined);
    const raw = new DetailedCellError(new CellError(type, 'Value cannot be coerced to number.'), `#${type}!`);
    const error = readCell('side', raw);
    if (typeof error === 'number') throw new Error('an error cell was read as a number');
    expect(error.key).toBe('side');
    expect(error.message).toMatch(/^side: /);
    expectOurOwnWords([error.message]);
    expect(error.message).not.toContain(type);
    const routine = ['DIV_BY_ZERO', 'NUM', 'CYCLE'].includes(type);
    expect(warn.mock.calls.flat().join(' ')).toBe(
      routine ? '' : `[engine] side: grid engine error ${type}: Value cannot be coerced to number.`,
    );
  });

  it('keeps the codes the server refuses and the rows show', () => {
    expect(gridError('x', 'DIV_BY_ZERO').code).toBe('division_by_zero');
    expect(gridError('x', 'CYCLE').code).toBe('cycle');
    expect(gridError('x', 'NUM').code).toBe('invalid_value');
    expect(gridError('x', 'VALUE').code).toBe('invalid_value');
    expect(gridError('x', 'something new').code).toBe('invalid_value');
  });
});

describe('borrowedWordsIn', () => {
  it.each([
    'side: the formula cannot be evaluated (VALUE: Value cannot be coerced to number.)',
    'unknown unit "furlongz": Unit "furlongz" not found.',
    'side: #DIV/0!',
    'side: #NAME?',
    'the unit is not known to mathjs',
    'as HyperFormula evaluates it',
    'reads as an A1 cell reference',
    'Undefined symbol x',
  ])('finds the borrowed words in %s', (text) => {
    expect(borrowedWordsIn(text)).not.toEqual([]);
  });

  it('finds none in our own words', () => {
    expect(borrowedWordsIn('side: unit "m" expects m but "25 kg" is kg; the key looks like a grid address')).toEqual([]);
  });
});
