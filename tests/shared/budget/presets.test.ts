import { allowancePresets, findPreset } from '@/shared/budget/presets';
import { validatePreset } from '@/shared/budget/validate-preset';

describe('allowance presets', () => {
  it('ships two valid presets', () => {
    expect(allowancePresets.map((p) => p.id)).toEqual(['aiaa-s120a', 'esa-margin']);
    for (const preset of allowancePresets) expect(validatePreset(preset)).toEqual([]);
  });

  it('finds a preset by id and answers undefined otherwise', () => {
    expect(findPreset('esa-margin')?.name).toMatch(/ESA/);
    expect(findPreset('nope')).toBeUndefined();
  });

  describe('esa-margin', () => {
    const esa = findPreset('esa-margin');

    it('has 5 %, 10 % and 20 % equipment margins in every category and a 20 % system margin of the predicted mass', () => {
      // ESA SRE-PA/2011.097: 5 % off-the-shelf, 10 % minor modification, 20 % new design or major modification;
      // a system margin of 20 % of the nominal dry mass including equipment margins
      expect(esa?.source).toMatch(/SRE-PA\/2011\.097/);
      expect(esa?.systemMarginPercent).toBe(20);
      expect(esa?.systemMarginBasis).toBe('predicted');
      expect(esa?.caveat).toMatch(/1\.2 × the predicted mass, a margin of 16\.7 % of the allocation/);
      for (const category of esa?.categories ?? []) {
        expect(esa?.table.off_the_shelf?.[category.id]).toBe(0.05);
        expect(esa?.table.modified?.[category.id]).toBe(0.1);
        expect(esa?.table.new_design?.[category.id]).toBe(0.2);
      }
    });
  });

  describe('esa-margin maturities', () => {
    it('are labelled in the words of the margin philosophy', () => {
      // ESA SRE-PA/2011.097: off-the-shelf; minor modification; new design or major modification
      expect(findPreset('esa-margin')?.maturities).toEqual([
        { id: 'off_the_shelf', label: 'Off-the-shelf' },
        { id: 'modified', label: 'Minor modification' },
        { id: 'new_design', label: 'New design or major modification' },
      ]);
    });
  });

  describe('aiaa-s120a', () => {
    const aiaa = findPreset('aiaa-s120a');
    const table = aiaa?.table ?? {};
    const categories = (aiaa?.categories ?? []).map((c) => c.id);

    it('says it is from memory and is to be verified', () => {
      expect(aiaa?.source).toMatch(/AIAA S-120A/);
      expect(aiaa?.caveat).toMatch(/from memory, verify against the standard/i);
      expect(aiaa?.systemMarginBasis).toBe('allocation');
    });

    it('says on screen that it is not the standard’s table, and marks the sail columns as our extrapolation', () => {
      expect(aiaa?.notice).toMatch(/not the AIAA S-120A table/);
      expect(aiaa?.categories.find((c) => c.id === 'membrane')?.label).toBe('Sail membrane (our extrapolation)');
      expect(aiaa?.categories.find((c) => c.id === 'boom')?.label).toBe('Booms (our extrapolation)');
      expect(aiaa?.categories.filter((c) => c.label.includes('extrapolation')).map((c) => c.id)).toEqual(['membrane', 'boom']);
    });

    const maturitiesByDesignMaturity = [
      'estimated',
      'layout',
      'pre_release_drawings',
      'released_drawings',
      'existing_hardware',
      'measured',
      'customer_furnished',
    ];

    it('lists the S-120A-style maturities', () => {
      expect(aiaa?.maturities.map((m) => m.id)).toEqual(maturitiesByDesignMaturity);
    });

    it('follows the recalled pattern: 18–35 % estimated (harness 50–100 %), 1–3 % existing, 0 % measured', () => {
      // AIAA S-120A-2015 (R2019) pattern, from memory: structure only, not authority
      for (const category of categories) {
        const estimated = table.estimated?.[category] ?? Number.NaN;
        if (category === 'harness') {
          expect(estimated).toBeGreaterThanOrEqual(0.5);
          expect(estimated).toBeLessThanOrEqual(1);
        } else {
          expect(estimated).toBeGreaterThanOrEqual(0.18);
          expect(estimated).toBeLessThanOrEqual(0.35);
        }
        expect(table.existing_hardware?.[category]).toBeGreaterThanOrEqual(0.01);
        expect(table.existing_hardware?.[category]).toBeLessThanOrEqual(0.03);
        expect(table.measured?.[category]).toBe(0);
      }
    });

    it('never grows the allowance as the design matures', () => {
      // Customer-furnished hardware stands outside the maturity sequence.
      const order = maturitiesByDesignMaturity.filter((id) => id !== 'customer_furnished');
      for (const category of categories) {
        const column = order.map((maturity) => table[maturity]?.[category] ?? Number.NaN);
        column.slice(1).forEach((value, i) => expect(value).toBeLessThanOrEqual(column[i] ?? Number.NaN));
      }
    });

    it('gives the harness the highest estimated allowance', () => {
      const estimated = table.estimated ?? {};
      expect(Math.max(...Object.values(estimated))).toBe(estimated.harness);
    });
  });
});
