import { findPreset } from '@/shared/budget/presets';
import { rollUpBudget } from '@/shared/budget/rollup';
import { BudgetInputError, type BudgetRowInput } from '@/shared/budget/types';

const esa = findPreset('esa-margin');
if (!esa) throw new Error('esa-margin preset missing');

// Demo data: invented masses.
const rows: BudgetRowInput[] = [
  { key: 'membrane', subsystem: 'Sail', cbe: 10, maturity: 'new_design', category: 'membrane' },
  { key: 'booms', subsystem: 'Sail', cbe: 20, maturity: 'modified', category: 'boom' },
  { key: 'obc', subsystem: 'Avionics', cbe: 5, maturity: 'off_the_shelf', category: 'electrical' },
];

describe('rollUpBudget', () => {
  it('adds allowances, predicted masses and subsystem sums', () => {
    // ESA SRE-PA/2011.097 margins: 20 % new design, 10 % modified, 5 % off-the-shelf
    const result = rollUpBudget(rows, esa, { allocation: 50 });
    expect(result.rows.map((r) => r.allowance)).toEqual([0.2, 0.1, 0.05]);
    expect(result.rows.map((r) => r.predicted)).toEqual([12, 22, 5.25]);
    expect(result.bySubsystem).toEqual([
      { subsystem: 'Sail', cbe: 30, predicted: 34 },
      { subsystem: 'Avionics', cbe: 5, predicted: 5.25 },
    ]);
    expect(result.total.cbe).toBe(35);
    expect(result.total.predicted).toBeCloseTo(39.25, 12);
  });

  it('computes the system margin as allocation − predicted against 20 % of the predicted mass', () => {
    // ESA SRE-PA/2011.097: a system margin of 20 % of the nominal dry mass including equipment margins, i.e.
    // allocation >= 1.2 x predicted, 16.7 % of the allocation. (The check compared 21.5 % of the allocation with
    // 20 % of the allocation before, which is not ESA's definition.)
    const result = rollUpBudget(rows, esa, { allocation: 50 });
    expect(result.systemMargin.kg).toBeCloseTo(10.75, 12);
    expect(result.systemMargin.percentOfAllocation).toBeCloseTo(21.5, 12);
    expect(result.systemMargin.percentOfPredicted).toBeCloseTo((10.75 / 39.25) * 100, 12);
    expect(result.systemMargin.requiredBasis).toBe('predicted');
    expect(result.systemMargin.requiredPercentOfBasis).toBe(20);
    expect(result.systemMargin.requiredPercent).toBeCloseTo(100 / 6, 12);
    expect(result.systemMargin.belowRequired).toBe(false);
  });

  it('holds the allocation to 1.2 × the predicted mass under ESA, not to 20 % of the allocation', () => {
    // ESA SRE-PA/2011.097: predicted 39.25 kg needs an allocation of at least 47.1 kg. 48 kg leaves 18.2 % of the
    // allocation: under 20 % of the allocation, yet enough by ESA's definition.
    const enough = rollUpBudget(rows, esa, { allocation: 48 });
    expect(enough.systemMargin.percentOfAllocation).toBeLessThan(20);
    expect(enough.systemMargin.belowRequired).toBe(false);
    expect(rollUpBudget(rows, esa, { allocation: 1.2 * 39.25 }).systemMargin.belowRequired).toBe(false);
    expect(rollUpBudget(rows, esa, { allocation: 47 }).systemMargin.belowRequired).toBe(true);
  });

  it('keeps a preset whose margin is a share of the allocation on that basis', () => {
    // AIAA-style preset: 15 % of the allocation (common practice). Predicted 39.25 kg in 46 kg leaves 14.7 %.
    const aiaa = findPreset('aiaa-s120a');
    if (!aiaa) throw new Error('aiaa-s120a preset missing');
    const lines = rows.map((row) => ({ ...row, maturity: 'measured' }));
    expect(rollUpBudget(lines, aiaa, { allocation: 41 }).systemMargin).toMatchObject({
      requiredPercent: 15,
      requiredBasis: 'allocation',
      belowRequired: true,
    });
    expect(rollUpBudget(lines, aiaa, { allocation: 42 }).systemMargin.belowRequired).toBe(false);
  });

  it('flags a margin below the required one, and a negative margin when over the allocation', () => {
    // 25 % of 39.25 kg predicted needs 49.06 kg: 49 kg is short.
    expect(rollUpBudget(rows, esa, { allocation: 49, requiredMarginPercent: 25 }).systemMargin.belowRequired).toBe(true);
    expect(rollUpBudget(rows, esa, { allocation: 49.1, requiredMarginPercent: 25 }).systemMargin.belowRequired).toBe(false);
    const over = rollUpBudget(rows, esa, { allocation: 35, requiredMarginPercent: 0 });
    expect(over.systemMargin.kg).toBeCloseTo(-4.25, 12);
    expect(over.systemMargin.belowRequired).toBe(true);
  });

  it('rolls up an empty budget to zero', () => {
    const result = rollUpBudget([], esa, { allocation: 10 });
    expect(result.total).toEqual({ cbe: 0, predicted: 0 });
    expect(result.systemMargin.percentOfAllocation).toBe(100);
    expect(result.systemMargin.percentOfPredicted).toBeNull();
  });

  it('names the row and field of an unknown maturity', () => {
    const bad = [...rows, { key: 'sensor', subsystem: 'Payload', cbe: 1, maturity: 'layout', category: 'payload' }];
    expect(() => rollUpBudget(bad, esa, { allocation: 50 })).toThrow(BudgetInputError);
    expect(() => rollUpBudget(bad, esa, { allocation: 50 })).toThrow(
      /^rows\[3\] \('sensor'\)\.maturity: unknown maturity 'layout' in preset 'esa-margin'/,
    );
  });

  it('names the row of a negative mass', () => {
    const bad = [{ ...rows[0], key: 'neg', cbe: -2 } as BudgetRowInput];
    expect(() => rollUpBudget(bad, esa, { allocation: 50 })).toThrow(/rows\[0\] \('neg'\)\.cbe: must be a finite mass >= 0 kg, got -2/);
  });

  it('names a duplicate key, a bad allocation and a bad required margin', () => {
    expect(() => rollUpBudget([...rows, rows[0] as BudgetRowInput], esa, { allocation: 50 })).toThrow(
      /rows\[3\]\.key: duplicate key 'membrane'/,
    );
    expect(() => rollUpBudget(rows, esa, { allocation: 0 })).toThrow(/allocation: must be a finite mass > 0 kg, got 0/);
    expect(() => rollUpBudget(rows, esa, { allocation: 50, requiredMarginPercent: -5 })).toThrow(
      /requiredMarginPercent: must be a percentage in \[0, 100\)/,
    );
  });
});
