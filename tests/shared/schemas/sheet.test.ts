import { sheetSchema } from '@/shared/schemas/sheet';
import squareSail from '@/shared/templates/square-sail.json';

const row = { key: 'sail_side', label: 'Sail side', subsystem: 'Sail', unit: 'm' };

function issues(parameters: unknown[]): string[] {
  const result = sheetSchema.safeParse({ name: 'test', parameters });
  return result.success ? [] : result.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
}

describe('sheetSchema', () => {
  it('accepts the square-sail template', () => {
    expect(sheetSchema.safeParse(squareSail).success).toBe(true);
  });

  it('accepts a value, a formula or a material row', () => {
    expect(
      issues([
        { ...row, value: 3 },
        { ...row, key: 'area', formula: '=sail_side^2' },
        { ...row, key: 'density', material: { id: 'polyimide', property: 'density' } },
      ]),
    ).toEqual([]);
  });

  it('needs exactly one of value, formula and material, naming the key and the field', () => {
    expect(issues([row])).toEqual([
      'parameters.0.value: parameter "sail_side": give exactly one of value, formula or material (none given)',
    ]);
    expect(issues([{ ...row, value: 3, formula: '=2' }])).toEqual([
      'parameters.0.formula: parameter "sail_side": give exactly one of value, formula or material (got value and formula)',
    ]);
  });

  it('refuses keys that are not snake_case or look like grid addresses', () => {
    expect(issues([{ ...row, key: 'boom2', value: 1 }])).toEqual([
      'parameters.0.key: key "boom2" looks like a grid address (letters then digits): put an underscore before the digits',
    ]);
    expect(issues([{ ...row, key: 'rc', value: 1 }])).toEqual(['parameters.0.key: key "rc" looks like a grid address (r and c with row and column numbers): choose a longer name']);
    expect(issues([{ ...row, key: 'SailSide', value: 1 }])[0]).toMatch(/^parameters\.0\.key: key "SailSide" must be snake_case/);
  });

  it('refuses formulas without "=", non-finite values, duplicate keys and unknown fields', () => {
    expect(issues([{ ...row, formula: 'sail_side' }])).toEqual([
      'parameters.0.formula: parameter "sail_side": formula must start with "="',
    ]);
    expect(issues([{ ...row, value: Number.POSITIVE_INFINITY }])[0]).toMatch(/^parameters\.0\.value/);
    expect(
      issues([
        { ...row, value: 1 },
        { ...row, value: 2 },
      ]),
    ).toEqual(['parameters.1.key: key "sail_side" is used twice']);
    expect(issues([{ ...row, value: 1, colour: 'red' }])[0]).toMatch(/colour/);
  });

  it('validates the budget settings', () => {
    expect(sheetSchema.safeParse({ name: 'x', budget: { preset: 'esa-margin', requiredMarginPercent: 20 }, parameters: [] }).success).toBe(
      true,
    );
    expect(sheetSchema.safeParse({ name: 'x', budget: { preset: 'esa-margin', requiredMarginPercent: 120 }, parameters: [] }).success).toBe(
      false,
    );
  });
});
