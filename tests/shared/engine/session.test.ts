import type { Sheet } from '@/shared/schemas/sheet';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { createSheetSession, type SheetSession } from '@/shared/engine/session';
import { syntheticSheet } from '@/tests/bench/synthetic-sheet';

const sheet: Sheet = {
  name: 'session test',
  parameters: [
    { key: 'side', label: 'side', subsystem: 's', unit: 'm', value: 10 },
    { key: 'thickness', label: 'thickness', subsystem: 's', unit: 'um', value: 2 },
    { key: 'area', label: 'area', subsystem: 's', unit: 'm^2', formula: '=side^2' },
    { key: 'volume', label: 'volume', subsystem: 's', unit: 'cm^3', formula: '=area * thickness' },
    { key: 'unrelated', label: 'unrelated', subsystem: 's', unit: 'kg', value: 3 },
    { key: 'double_mass', label: 'double', subsystem: 's', unit: 'kg', formula: '=2 * unrelated' },
    { key: 'constant', label: 'constant', subsystem: 'Constants', unit: 'm/s', value: 299_792_458, protected: true },
  ],
};

let session: SheetSession;
beforeEach(() => {
  session = createSheetSession(sheet);
});
afterEach(() => session.destroy());

describe('createSheetSession', () => {
  it('recomputes only the dependents of an edited input', () => {
    const result = session.setInput('side', 20);
    expect(result).toEqual({ ok: true, recomputed: ['side', 'area', 'volume'] });
    expect(session.values().area?.value).toBeCloseTo(400, 12);
    expect(session.setInput('unrelated', 4)).toEqual({ ok: true, recomputed: ['unrelated', 'double_mass'] });
  });

  it('accepts a value with its own unit and converts it', () => {
    session.setInput('side', '2 km');
    expect(session.values().side).toEqual({ value: 2000, unit: 'm' });
    expect(session.values().area?.value).toBeCloseTo(4e6, 6);
  });

  it('refuses bad values and protected rows without changing anything', () => {
    expect(session.setInput('side', '3 kg')).toMatchObject({ ok: false, error: { key: 'side', code: 'dimension_mismatch' } });
    expect(session.setInput('side', Number.NaN)).toMatchObject({ ok: false, error: { key: 'side', code: 'invalid_value' } });
    expect(session.setInput('side', 'ten')).toMatchObject({ ok: false, error: { key: 'side', code: 'invalid_value' } });
    expect(session.setInput('constant', 1)).toMatchObject({ ok: false, error: { key: 'constant', code: 'protected' } });
    expect(session.setInput('nothing', 1)).toMatchObject({ ok: false, error: { key: 'nothing', code: 'unknown_key' } });
    expect(session.canUndo()).toBe(false);
    expect(session.values().side?.value).toBe(10);
  });

  it('undoes and redoes edits', () => {
    session.setInput('side', 20);
    session.setFormula('area', '=side * side * 3');
    expect(session.values().area?.value).toBeCloseTo(1200, 12);
    expect(session.undo()).toMatchObject({ ok: true });
    expect(session.values().area?.value).toBeCloseTo(400, 12);
    expect(session.undo()).toMatchObject({ ok: true });
    expect(session.values().area?.value).toBeCloseTo(100, 12);
    expect(session.undo()).toBe(false);
    expect(session.redo()).toMatchObject({ ok: true });
    expect(session.values().side?.value).toBe(20);
    session.setInput('side', 5);
    expect(session.canRedo()).toBe(false);
    expect(session.redo()).toBe(false);
    expect(session.sheet().parameters.find((parameter) => parameter.key === 'side')?.value).toBe(5);
  });

  it('reports a cycle made by an edit, and clears it on undo', () => {
    session.setFormula('side', '=SQRT(volume / thickness)');
    expect(session.errors().map((error) => [error.key, error.code])).toEqual([
      ['side', 'cycle'],
      ['area', 'cycle'],
      ['volume', 'cycle'],
    ]);
    expect(session.errors()[0]?.message).toBe('side: is on a cycle of formulas: side -> volume -> area -> side');
    expect(session.values().double_mass?.value).toBe(6);
    session.undo();
    expect(session.errors()).toEqual([]);
    expect(session.values().volume?.value).toBeCloseTo(200, 9);
  });

  it('re-checks the rows that read a row whose unit changes', () => {
    const side = sheet.parameters[0];
    if (side === undefined) throw new Error('fixture');
    session.updateParameter('side', { ...side, unit: 'kg' });
    expect(session.errors()).toEqual([
      { key: 'area', code: 'dimension_mismatch', message: 'area: unit "m^2" expects m^2 but the formula gives kg^2' },
      { key: 'volume', code: 'dependency_error', message: 'volume: depends on area, which has an error' },
    ]);
    session.undo();
    expect(session.errors()).toEqual([]);
  });

  it('keeps a broken formula as an error of its row and recovers when it is fixed', () => {
    session.setFormula('area', '=side ^');
    expect(session.errors().map((error) => error.code)).toEqual(['syntax_error', 'dependency_error']);
    session.setFormula('area', '=side * side');
    expect(session.errors()).toEqual([]);
    expect(session.values().volume?.value).toBeCloseTo(200, 9);
  });

  it('inserts and removes rows, with undo', () => {
    expect(
      session.insertParameter({ key: 'perimeter', label: 'p', subsystem: 's', unit: 'm', formula: '=4 * side' }, 'area'),
    ).toMatchObject({ ok: true });
    expect(
      session
        .sheet()
        .parameters.map((parameter) => parameter.key)
        .slice(0, 4),
    ).toEqual(['side', 'thickness', 'perimeter', 'area']);
    expect(session.values().perimeter?.value).toBe(40);
    session.setInput('side', 3);
    expect(session.values().perimeter?.value).toBe(12);
    expect(session.removeParameter('area')).toMatchObject({ ok: true });
    expect(session.errors()).toEqual([{ key: 'volume', code: 'unknown_key', message: 'volume: unknown key "area" in the formula' }]);
    session.undo();
    expect(session.errors()).toEqual([]);
    expect(session.values().area?.value).toBe(9);
    session.undo();
    session.undo();
    expect(session.values().perimeter).toBeUndefined();
    expect(session.insertParameter({ key: 'side', label: 'x', subsystem: 's', unit: 'm', value: 1 })).toMatchObject({
      ok: false,
      error: { code: 'duplicate_key' },
    });
    expect(session.insertParameter({ key: 'boom2', label: 'x', subsystem: 's', unit: 'm', value: 1 })).toMatchObject({
      ok: false,
      error: { code: 'invalid_key' },
    });
    expect(session.removeParameter('constant')).toMatchObject({ ok: false, error: { code: 'protected' } });
  });

  it('follows a change of allowance preset', () => {
    const budgeted = createSheetSession({
      name: 'budget',
      budget: { preset: 'esa-margin' },
      parameters: [
        { key: 'bus', label: 'bus', subsystem: 's', unit: 'kg', value: 10, mass: { maturity: 'new_design', category: 'structure' } },
        { key: 'predicted', label: 'predicted', subsystem: 's', unit: 'kg', formula: '=PREDICTED(bus)' },
      ],
    });
    // ESA SRE-PA/2011.097: 20 % on a new design.
    expect(budgeted.values().predicted?.value).toBeCloseTo(12, 12);
    budgeted.setBudget({ preset: 'aiaa-s120a' });
    expect(budgeted.errors()).toEqual([expect.objectContaining({ key: 'predicted', code: 'budget_error' })]);
    budgeted.undo();
    expect(budgeted.values().predicted?.value).toBeCloseTo(12, 12);
    budgeted.destroy();
  });

  it('drops the value of a row whose input breaks even when its own result stays the same, and brings it back', () => {
    const guarded = createSheetSession({
      name: 'guarded',
      parameters: [
        { key: 'a', label: 'a', subsystem: 's', unit: 'm', value: 1 },
        { key: 'b', label: 'b', subsystem: 's', unit: 'm', formula: '=a * 2' },
        // Gives 1 whatever b is, also when b has no value at all.
        { key: 'flag', label: 'flag', subsystem: 's', unit: '', formula: '=IF(b > a, 1, 1)' },
      ],
    });
    try {
      expect(guarded.values().flag?.value).toBe(1);
      guarded.setFormula('b', '=a *');
      expect(guarded.values().flag).toBeUndefined();
      expect(guarded.errors().map((error) => [error.key, error.code])).toEqual([
        ['b', 'syntax_error'],
        ['flag', 'dependency_error'],
      ]);
      guarded.setFormula('b', '=a * 3');
      expect(guarded.values().flag?.value).toBe(1);
      expect(guarded.errors()).toEqual([]);
    } finally {
      guarded.destroy();
    }
  });

  describe('on a large sheet', () => {
    const large = syntheticSheet(400);
    const inputs = large.parameters.filter((parameter) => parameter.value !== undefined).map((parameter) => parameter.key);
    const formulaRows = large.parameters.filter((parameter) => parameter.formula !== undefined).map((parameter) => parameter.key);

    /** Every row that reads `key`, directly or through other rows, and `key` itself. */
    function cone(key: string): Set<string> {
      const found = new Set([key]);
      for (const parameter of large.parameters) {
        const reads = parameter.formula?.match(/p_\d+/g) ?? [];
        if (reads.some((read) => found.has(read))) found.add(parameter.key);
      }
      return found;
    }

    it('recomputes only the rows that read the edited input, and those that changed are among them', () => {
      const live = createSheetSession(large);
      try {
        const before = live.values();
        const edited = inputs[inputs.length - 5] ?? 'p_0';
        const result = live.setInput(edited, 7.5);
        if (!result.ok) throw new Error(result.error.message);
        const after = live.values();
        const changed = Object.keys(after).filter((key) => after[key]?.value !== before[key]?.value);
        expect(changed).toContain(edited);
        expect(result.recomputed.length).toBeLessThan(large.parameters.length / 2);
        expect(new Set(result.recomputed)).toEqual(new Set([...result.recomputed].filter((key) => cone(edited).has(key))));
        for (const key of changed) expect(result.recomputed).toContain(key);
      } finally {
        live.destroy();
      }
    });

    it('gives the values and errors of a full evaluation after every edit, errors coming and going included', () => {
      const live = createSheetSession(large);
      const side = formulaRows[20] ?? 'p_3';
      const edits: ((session: SheetSession) => unknown)[] = [
        (session) => session.setInput(inputs[0] ?? 'p_0', 12),
        (session) => session.setInput(inputs[3] ?? 'p_1', '2 km'),
        // A broken formula: its readers lose their values, and get them back when it is fixed.
        (session) => session.setFormula(side, '=p_0 +'),
        (session) => session.setInput(inputs[0] ?? 'p_0', 13),
        (session) => session.setFormula(side, '=p_0 * 2'),
        // A unit of another dimension: the readers fail their dimension checks.
        (session) => session.updateParameter('p_1', { ...(large.parameters[1] ?? { key: 'p_1', label: '', subsystem: '' }), unit: 'kg' }),
        (session) => session.undo(),
        (session) => session.setFormula('p_2', `=${formulaRows.at(-1) ?? 'p_3'}`),
        (session) => session.undo(),
        (session) => session.setInput(inputs[1] ?? 'p_1', 0),
        (session) => session.removeParameter(formulaRows[10] ?? 'p_3'),
        (session) => session.setInput(inputs[2] ?? 'p_2', 99),
        (session) => session.undo(),
        (session) => session.undo(),
      ];
      let errorsSeen = 0;
      try {
        for (const edit of edits) {
          edit(live);
          const full = evaluateSheet(live.sheet());
          expect(live.errors()).toEqual(full.errors);
          expect(live.values()).toEqual(full.values);
          errorsSeen += full.errors.length;
        }
        expect(errorsSeen).toBeGreaterThan(0);
      } finally {
        live.destroy();
      }
    });
  });
});
