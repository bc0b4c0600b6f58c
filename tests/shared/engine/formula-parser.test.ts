import { HyperFormula } from 'hyperformula';
import { constantValue } from '@/shared/engine/functions';
import { FormulaSyntaxError, parseFormula, referencedKeys } from '@/shared/engine/formula-parser';
import { hyperFormulaConfig, toHyperFormulaText } from '@/shared/engine/hyperformula-cells';

describe('parseFormula', () => {
  const hf = HyperFormula.buildFromArray([[]], hyperFormulaConfig(1));
  afterAll(() => hf.destroy());

  // HyperFormula is the reference grammar: the same text must give the same number.
  it.each([
    '=-2^2',
    '=2^3^2',
    '=1+2*3-4/5',
    '=2*50%',
    '=-(1+2)*3',
    '=1<2',
    '=2-3-4',
    '=8/4/2',
    '=+3',
    '=1.5e3*2e-3',
    '=.5*4',
    '=10%^2',
    '=(1+1)^-1',
  ])('evaluates %s as HyperFormula does', (text) => {
    const ours = constantValue(parseFormula(text));
    const theirs = hf.calculateFormula(text, 0);
    expect(ours).toBeCloseTo(Number(theirs), 12);
  });

  it('accepts an upper-case exponent, which HyperFormula itself refuses, and writes it for HyperFormula in its own syntax', () => {
    const text = toHyperFormulaText(parseFormula('=2E-3 * side + 1E+21'), () => 0);
    expect(text).toBe('((0.002*$A$1)+1e+21)');
    expect(hf.calculateFormula(`=${text.replace(/\$A\$1/g, '1')}`, 0)).toBeCloseTo(1e21, -6);
  });

  it('lists the keys a formula refers to, once each', () => {
    expect(referencedKeys(parseFormula('=film_thickness * film_density * sail_area + SQRT(film_thickness)'))).toEqual([
      'film_thickness',
      'film_density',
      'sail_area',
    ]);
  });

  it('reads function names in any case', () => {
    expect(parseFormula('=sqrt(4)')).toEqual({ kind: 'call', name: 'SQRT', args: [{ kind: 'number', value: 4 }] });
  });

  it.each([
    ['side', 'a formula must start with "="'],
    ['=', 'the formula is empty after "="'],
    ['=(a', 'expected ")" but found end of formula at character 4'],
    ['=a b', 'expected an operator or end of formula but found "b" at character 4'],
    ['=MAX(a;b)', 'unexpected ";" at character 7'],
    ['="text"', 'text values are not supported at character 2'],
    ['=MAX(a,', 'expected a number, a parameter key, a function or "(" but found end of formula at character 8'],
  ])('refuses %s: %s', (text, message) => {
    expect(() => parseFormula(text)).toThrow(new FormulaSyntaxError(message));
  });

  it.each([
    ['brackets', `=${'('.repeat(20_000)}a${')'.repeat(20_000)}`],
    ['calls', `=${'ABS('.repeat(20_000)}a${')'.repeat(20_000)}`],
    ['signs', `=${'-'.repeat(20_000)}a`],
    ['a chain of operators', `=${Array(20_000).fill('a').join('+')}`],
  ])('refuses a formula nested too deep (%s) with a syntax error, not a stack overflow', (_what, text) => {
    const deep = new FormulaSyntaxError('the formula nests deeper than 64 levels; split it over several rows');
    expect(() => parseFormula(text)).toThrow(deep);
  });

  it('accepts a chain of 64 terms, which HyperFormula still parses', () => {
    const text = `=${Array(64).fill('a').join('+')}`;
    expect(hf.calculateFormula(`=${toHyperFormulaText(parseFormula(text), () => 0).replace(/\$A\$1/g, '1')}`, 0)).toBe(64);
  });
});
