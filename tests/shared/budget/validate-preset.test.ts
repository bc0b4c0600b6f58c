import { findPreset } from '@/shared/budget/presets';
import { isValidPreset, validatePreset } from '@/shared/budget/validate-preset';

const esa = findPreset('esa-margin');
if (!esa) throw new Error('esa-margin preset missing');

describe('validatePreset', () => {
  it('accepts a shipped preset and narrows it', () => {
    expect(validatePreset(esa)).toEqual([]);
    expect(isValidPreset(JSON.parse(JSON.stringify(esa)))).toBe(true);
  });

  it('names a cell out of range', () => {
    const edited = { ...esa, table: { ...esa.table, modified: { ...esa.table.modified, harness: 1.5 } } };
    expect(validatePreset(edited)).toEqual([
      {
        path: 'table.modified.harness',
        message: 'must be an allowance fraction in [0, 1] (0–100 %), got 1.5',
      },
    ]);
  });

  it('names a missing cell, a missing row and an unknown row', () => {
    const { harness: _dropped, ...modifiedWithoutHarness } = esa.table.modified ?? {};
    const { new_design: _row, ...table } = esa.table;
    const issues = validatePreset({
      ...esa,
      table: { ...table, modified: modifiedWithoutHarness, typo: {} },
    });
    expect(issues.map((i) => i.path)).toEqual(['table.typo', 'table.modified.harness', 'table.new_design']);
    expect(issues[1]?.message).toMatch(/got nothing/);
  });

  it('names an unknown category in a row', () => {
    const edited = { ...esa, table: { ...esa.table, modified: { ...esa.table.modified, cabling: 0.1 } } };
    expect(validatePreset(edited)).toEqual([{ path: 'table.modified.cabling', message: "'cabling' is not a category of this preset" }]);
  });

  it('names duplicate and malformed ids, empty texts and a bad system margin', () => {
    const edited = {
      ...esa,
      name: '',
      maturities: [...esa.maturities, { id: 'modified', label: 'again' }, { id: 'Bad Id', label: 'x' }],
      systemMarginPercent: 120,
    };
    expect(validatePreset(edited)).toEqual([
      { path: 'name', message: 'must be a non-empty text' },
      { path: 'maturities[3].id', message: "duplicate id 'modified'" },
      { path: 'maturities[4].id', message: 'must be an id of lower-case letters, digits, _ or -' },
      { path: 'systemMarginPercent', message: 'must be a percentage in [0, 100)' },
    ]);
  });

  it('names a system-margin basis that is neither the allocation nor the predicted mass', () => {
    expect(validatePreset({ ...esa, systemMarginBasis: 'dry' })).toEqual([
      { path: 'systemMarginBasis', message: "must be 'allocation' or 'predicted' (what the system margin is a share of)" },
    ]);
  });

  it('refuses what is not an object', () => {
    expect(validatePreset(null)).toEqual([{ path: '', message: 'a preset must be an object' }]);
    expect(validatePreset({})).toHaveLength(9);
  });
});
