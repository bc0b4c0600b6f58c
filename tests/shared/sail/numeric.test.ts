import { bisect, linspace, maximise } from '@/shared/sail/numeric';

describe('linspace', () => {
  it('spans both ends', () => {
    expect(linspace(0, 1, 5)).toEqual([0, 0.25, 0.5, 0.75, 1]);
  });

  it('refuses fewer than two points', () => {
    expect(() => linspace(0, 1, 1)).toThrow(/count must be an integer >= 2, got 1/);
  });
});

describe('maximise and bisect', () => {
  it('find a maximum and a root', () => {
    expect(maximise((x) => -(x - 0.3) * (x - 0.3), 0, 1)).toBeCloseTo(0.3, 6);
    expect(bisect((x) => x * x - 2, 0, 2)).toBeCloseTo(Math.SQRT2, 12);
  });

  it('stop at the resolution of doubles when asked for no tolerance', () => {
    expect(bisect((x) => x - 1e-3, 0, 1, 0)).toBeCloseTo(1e-3, 15);
    expect(maximise((x) => -Math.abs(x - 0.5), 0, 1, 0)).toBeCloseTo(0.5, 12);
  });

  it('refuses a bracket without a sign change', () => {
    expect(() => bisect((x) => x * x + 1, -1, 1)).toThrow(/bisect: f does not change sign on \[-1, 1\]/);
  });
});
