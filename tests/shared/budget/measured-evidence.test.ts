import { needsWeighingReport, whyNotMeasured } from '@/shared/budget/measured-evidence';

// common practice: a mass counts as measured only with the weighing of the item on record.
describe('whyNotMeasured', () => {
  it('asks for a weighing report before a row may be measured, naming the row', () => {
    expect(whyNotMeasured('boom_mass', 'measured', 0)).toBe(
      'Row "boom_mass" can be marked measured only with a weighing report attached; attach the report first',
    );
    expect(whyNotMeasured('boom_mass', 'measured', 1)).toBeUndefined();
  });

  it('asks nothing of the other maturities or of rows outside the budget', () => {
    for (const maturity of ['estimated', 'layout', 'existing_hardware', 'customer_furnished', undefined]) {
      expect(needsWeighingReport(maturity)).toBe(false);
      expect(whyNotMeasured('boom_mass', maturity, 0)).toBeUndefined();
    }
  });
});
