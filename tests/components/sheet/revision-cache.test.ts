import { applyCreate, applyUpdate, restoreRows, toSheet } from '@/components/sheet/revision-cache';
import { detailFor } from './sheet-fixtures';

const keys = (detail: ReturnType<typeof detailFor>) => detail.sheet.parameters.map((row) => row.key);
const row = (detail: ReturnType<typeof detailFor>, key: string) => detail.sheet.parameters.find((candidate) => candidate.key === key);

describe('revision cache', () => {
  it('renames a row and the whole-word uses of its key in other formulas, leaving other rows as they were', () => {
    const detail = detailFor();
    const renamed = applyUpdate(detail, 'sail_side', { version: 1, key: 'side' });
    expect(row(renamed, 'side')?.value).toBe(40);
    expect(row(renamed, 'sail_area')?.formula).toBe('=side^2');
    expect(row(renamed, 'boom_length')?.formula).toBe('=side * SQRT(2) / 2');
    expect(row(renamed, 'sail_efficiency')).toBe(row(detail, 'sail_efficiency'));
  });

  it('turns an input into a formula row, dropping the value', () => {
    const updated = applyUpdate(detailFor(), 'sail_side', { version: 1, formula: '=boom_length * 2' });
    expect(row(updated, 'sail_side')).toMatchObject({ formula: '=boom_length * 2' });
    expect(row(updated, 'sail_side')?.value).toBeUndefined();
  });

  it('adds a row at the end of its subsystem', () => {
    const added = applyCreate(detailFor(), {
      parameter: { key: 'harness_mass', label: 'Harness mass', subsystem: 'Spacecraft', unit: 'kg', value: 1 },
    });
    const order = keys(added);
    expect(order.indexOf('harness_mass')).toBe(order.indexOf('payload_mass') + 1);
    expect(row(added, 'harness_mass')?.version).toBe(1);
  });

  it('puts back only the rows a failed change touched, keeping what arrived meanwhile', () => {
    const before = detailFor();
    const failed = applyUpdate(before, 'sail_side', { version: 1, value: 50 });
    const meanwhile = applyUpdate(failed, 'bus_mass', { version: 1, value: 12 });
    const restored = restoreRows(meanwhile, before, ['sail_side']);
    expect(row(restored, 'sail_side')?.value).toBe(40);
    expect(row(restored, 'bus_mass')?.value).toBe(12);
    expect(keys(restored)).toEqual(keys(before));
  });

  it('gives the engine the rows without versions or authors', () => {
    const parameter = toSheet(detailFor()).parameters[0];
    expect(parameter).not.toHaveProperty('version');
    expect(parameter).not.toHaveProperty('subsystemId');
    expect(parameter).not.toHaveProperty('updatedBy');
  });
});
