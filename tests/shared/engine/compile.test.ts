import { evaluateCompiled } from '@/shared/engine/compile';
import { evaluateSheet, type Evaluation, type Overrides } from '@/shared/engine/evaluate';
import { squareSailTemplate } from '@/shared/templates';
import { syntheticSheet } from '@/tests/bench/synthetic-sheet';

function expectSameResults(compiled: Evaluation, reference: Evaluation): void {
  expect(Object.keys(compiled.values).sort()).toEqual(Object.keys(reference.values).sort());
  for (const [key, value] of Object.entries(reference.values)) {
    const other = compiled.values[key];
    expect(other?.unit).toBe(value.unit);
    // Both evaluate the same tree in IEEE doubles; only the order of library calls may differ in the last bit.
    expect(Math.abs((other?.value ?? Number.NaN) - value.value)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(value.value)));
  }
}

describe('compiled evaluation', () => {
  it('gives the same values as HyperFormula on the square-sail template', () => {
    const sheet = squareSailTemplate();
    const cases: Overrides[] = [{}, { cone_angle: 35, distance: 0.7 }, { sail_side: '800 m', boom_count: 3 }];
    for (const overrides of cases) {
      const reference = evaluateSheet(sheet, overrides);
      expect(reference.errors).toEqual([]);
      expectSameResults(evaluateCompiled(sheet, overrides), reference);
    }
  });

  it('gives the same values as HyperFormula on a 1,000-parameter sheet split over several generated functions', () => {
    const sheet = syntheticSheet(1000);
    const reference = evaluateSheet(sheet);
    expect(reference.errors).toEqual([]);
    expectSameResults(evaluateCompiled(sheet), reference);
  });

  it('gives the same values through closures, for environments that forbid generated code', () => {
    const template = squareSailTemplate();
    expectSameResults(
      evaluateCompiled(template, { cone_angle: 20 }, { generatedCode: false }),
      evaluateSheet(template, { cone_angle: 20 }),
    );
    const sheet = syntheticSheet(300);
    expectSameResults(evaluateCompiled(sheet, {}, { generatedCode: false }), evaluateSheet(sheet));
  });

  it('agrees with HyperFormula on every function and operator a formula may use', () => {
    const formulas = [
      '=SQRT(x)',
      '=POWER(x, 3)',
      '=EXP(x)',
      '=LN(x)',
      '=LOG10(x)',
      '=LOG(x)',
      '=LOG(x, 2)',
      '=ABS(-x)',
      '=SIGN(-x)',
      '=ROUND(x, 1)',
      '=ROUND(-x)',
      '=ROUNDUP(-x, 1)',
      '=ROUNDDOWN(x, 2)',
      '=MIN(x, y, 2)',
      '=MAX(x, y)',
      '=SUM(x, y, 1)',
      '=AVERAGE(x, y)',
      '=SIN(x)',
      '=COS(x)',
      '=TAN(x)',
      '=ASIN(y / 10)',
      '=ACOS(y / 10)',
      '=ATAN(x)',
      '=ATAN2(x, -y)',
      '=PI()',
      '=IF(x > y, x, y)',
      '=IF(x = y, 1, 2)',
      '=(x <> y) + (x <= y) + (x >= y) + (x < y)',
      '=x > y',
      '=-x^2',
      '=x^-0.5',
      '=25%',
    ];
    const sheet = {
      name: 'functions',
      parameters: [
        { key: 'x', label: 'x', subsystem: 's', unit: '', value: 2.345 },
        { key: 'y', label: 'y', subsystem: 's', unit: '', value: 1.5 },
        // Inverse trigonometric functions give angles.
        ...formulas.map((formula, index) => ({
          key: `f_${index}`,
          label: formula,
          subsystem: 's',
          unit: /^=A(SIN|COS|TAN)/.test(formula) ? 'rad' : '',
          formula,
        })),
      ],
    };
    const reference = evaluateSheet(sheet);
    expect(reference.errors).toEqual([]);
    expectSameResults(evaluateCompiled(sheet), reference);
    expectSameResults(evaluateCompiled(sheet, {}, { generatedCode: false }), reference);
  });

  it('reports the same rows in error as HyperFormula', () => {
    const sheet = {
      name: 'errors',
      parameters: [
        { key: 'zero', label: 'zero', subsystem: 's', unit: 'm', value: 0 },
        { key: 'one', label: 'one', subsystem: 's', unit: 'm', value: 1 },
        { key: 'ratio', label: 'ratio', subsystem: 's', unit: '', formula: '=one / zero' },
        { key: 'after', label: 'after', subsystem: 's', unit: '', formula: '=ratio + 1' },
        { key: 'bad', label: 'bad', subsystem: 's', unit: 'kg', formula: '=one' },
        { key: 'fine', label: 'fine', subsystem: 's', unit: 'm', formula: '=IF(one >= zero, one, zero) + 50%*one' },
      ],
    };
    const compiled = evaluateCompiled(sheet);
    const reference = evaluateSheet(sheet);
    expect(compiled.errors.map((error) => [error.key, error.code === 'division_by_zero' ? 'invalid_value' : error.code])).toEqual(
      reference.errors.map((error) => [error.key, error.code === 'division_by_zero' ? 'invalid_value' : error.code]),
    );
    expect(compiled.values.fine?.value).toBe(1.5);
    expectSameResults(compiled, reference);
  });
});
