import { growthAllowance, predictedMass } from '@/shared/budget/allowance';
import { findPreset } from '@/shared/budget/presets';
import { BudgetInputError } from '@/shared/budget/types';

const esa = findPreset('esa-margin');
const aiaa = findPreset('aiaa-s120a');
if (!esa || !aiaa) throw new Error('shipped presets missing');

describe('growthAllowance', () => {
  it('reads the preset cell', () => {
    // ESA SRE-PA/2011.097: 20 % for a new design
    expect(growthAllowance(esa, 'new_design', 'boom')).toBe(0.2);
    expect(growthAllowance(aiaa, 'measured', 'harness')).toBe(0);
  });

  it('names an unknown maturity with the preset and the known ids', () => {
    expect(() => growthAllowance(esa, 'layout', 'boom')).toThrow(BudgetInputError);
    expect(() => growthAllowance(esa, 'layout', 'boom')).toThrow(
      "maturity: unknown maturity 'layout' in preset 'esa-margin' (known: off_the_shelf, modified, new_design)",
    );
  });

  it('names an unknown category', () => {
    expect(() => growthAllowance(aiaa, 'layout', 'sail')).toThrow(/category: unknown category 'sail' in preset 'aiaa-s120a'/);
  });

  it('names a missing cell of an edited preset', () => {
    const edited = { ...esa, table: { ...esa.table, modified: {} } };
    expect(() => growthAllowance(edited, 'modified', 'boom')).toThrow(/table.modified.boom: preset 'esa-margin' has no allowance/);
  });
});

describe('predictedMass', () => {
  it('is cbe × (1 + allowance)', () => {
    // ESA SRE-PA/2011.097: a 10 kg new-design unit with its 20 % margin counts as 12 kg
    expect(predictedMass(10, 0.2)).toBeCloseTo(12, 12);
    expect(predictedMass(0, 0.5)).toBe(0);
  });

  it('refuses a negative mass or allowance', () => {
    expect(() => predictedMass(-1, 0.1)).toThrow(/cbe: must be a finite mass >= 0 kg, got -1/);
    expect(() => predictedMass(1, Number.NaN)).toThrow(/allowance: must be a finite fraction >= 0, got NaN/);
  });
});
