import { mergedOrder, resolveMerge, sameContent, threeWayMerge, type MergeRow } from '@/shared/revisions/merge';

const booms = '00000000-0000-4000-8000-000000000001';
const optics = '00000000-0000-4000-8000-000000000002';

function row(key: string, fields: Partial<MergeRow> = {}): MergeRow {
  return { key, label: key, subsystem: 'Booms', subsystemId: booms, unit: 'm', value: 1, ...fields } as MergeRow;
}

describe('threeWayMerge', () => {
  const base = [row('a'), row('b'), row('c'), row('d')];

  it('takes rows changed only in the study and keeps rows changed only in the draft', () => {
    const draft = [row('a', { value: 2 }), row('b'), row('c'), row('d')];
    const study = [row('a'), row('b', { value: 3 }), row('c'), row('d')];
    const plan = threeWayMerge(base, draft, study);
    expect(plan.conflicts).toEqual([]);
    expect(plan.steps).toEqual([{ action: 'update', key: 'b', from: row('b'), row: row('b', { value: 3 }) }]);
  });

  it('lists rows changed in both to different content as conflicts with all three versions', () => {
    const draft = [row('a', { value: 2 }), row('b'), row('c'), row('d')];
    const study = [row('a', { value: 3 }), row('b'), row('c'), row('d')];
    const plan = threeWayMerge(base, draft, study);
    expect(plan.steps).toEqual([]);
    expect(plan.conflicts).toEqual([{ key: 'a', base: row('a'), draft: row('a', { value: 2 }), study: row('a', { value: 3 }) }]);
  });

  it('does nothing for rows changed in both to the same content', () => {
    const changed = [row('a', { formula: '=b*2', value: undefined }), row('b'), row('c'), row('d')];
    expect(threeWayMerge(base, changed, changed)).toEqual({ steps: [], conflicts: [] });
  });

  it('adds and removes rows from the study, and treats a rename as a removal and an addition', () => {
    const draft = base;
    const study = [row('a'), row('b'), row('e', { value: 5 }), row('renamed_d')];
    const plan = threeWayMerge(base, draft, study);
    expect(plan.conflicts).toEqual([]);
    expect(plan.steps).toEqual([
      { action: 'delete', key: 'c', from: row('c') },
      { action: 'delete', key: 'd', from: row('d') },
      { action: 'create', key: 'e', row: row('e', { value: 5 }) },
      { action: 'create', key: 'renamed_d', row: row('renamed_d') },
    ]);
  });

  it('keeps a row the draft removed and the study left alone, and conflicts when the study changed it', () => {
    const draft = [row('a'), row('b')];
    const study = [row('a'), row('b'), row('c'), row('d', { note: 'checked' })];
    const plan = threeWayMerge(base, draft, study);
    expect(plan.steps).toEqual([]);
    expect(plan.conflicts).toEqual([{ key: 'd', base: row('d'), draft: null, study: row('d', { note: 'checked' }) }]);
  });

  it('conflicts on a key both sides added with different content', () => {
    const plan = threeWayMerge(base, [...base, row('x', { value: 1 })], [...base, row('x', { value: 2 })]);
    expect(plan.conflicts.map((conflict) => [conflict.key, conflict.base])).toEqual([['x', null]]);
  });

  it('compares subsystems by id, not by the name the row carries', () => {
    const renamedSubsystem = row('a', { subsystem: 'Boom assembly' });
    expect(sameContent(row('a'), renamedSubsystem)).toBe(true);
    expect(sameContent(row('a'), row('a', { subsystemId: optics }))).toBe(false);
    expect(sameContent(row('a'), row('a', { protected: false }))).toBe(true);
    expect(sameContent(row('a', { mass: { maturity: 'estimated', category: 'structure' } }), row('a'))).toBe(false);
  });
});

describe('resolveMerge', () => {
  const base = [row('a'), row('b')];
  const draft = [row('a', { value: 2 }), row('b', { value: 2 })];
  const study = [row('a', { value: 3 })];
  const plan = threeWayMerge(base, draft, study);

  it('needs a resolution for every conflict and only for conflicts', () => {
    const missing = resolveMerge(plan, { a: 'study' });
    expect(missing).toEqual({ ok: false, unresolved: [expect.objectContaining({ key: 'b' })], notConflicts: [] });
    expect(resolveMerge(plan, { a: 'study', b: 'draft', zz: 'draft' })).toEqual(
      expect.objectContaining({ ok: false, unresolved: [], notConflicts: ['zz'] }),
    );
  });

  it("takes the study's row (or its removal) where resolved so, and leaves the draft's otherwise", () => {
    expect(resolveMerge(plan, { a: 'study', b: 'study' })).toEqual({
      ok: true,
      steps: [
        { action: 'update', key: 'a', from: row('a', { value: 2 }), row: row('a', { value: 3 }) },
        { action: 'delete', key: 'b', from: row('b', { value: 2 }) },
      ],
    });
    expect(resolveMerge(plan, { a: 'draft', b: 'draft' })).toEqual({ ok: true, steps: [] });
  });
});

describe('mergedOrder', () => {
  it("keeps the draft's order and places new rows after the row before them in the study", () => {
    const steps = [
      { action: 'create', key: 'first', row: row('first') },
      { action: 'create', key: 'x', row: row('x') },
      { action: 'create', key: 'y', row: row('y') },
      { action: 'delete', key: 'c', from: row('c') },
    ] as const;
    expect(mergedOrder(['a', 'b', 'c', 'd'], ['first', 'b', 'a', 'c', 'x', 'y', 'd'], steps)).toEqual(['first', 'a', 'x', 'y', 'b', 'd']);
  });
});
