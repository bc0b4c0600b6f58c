import { editText, formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';

describe('formatNumber', () => {
  it('rounds to significant digits without float noise', () => {
    expect(formatNumber(0.1 + 0.2)).toBe('0.3');
    expect(formatNumber(6.284559999999999)).toBe('6.285');
    expect(formatNumber(1600)).toBe('1600');
    expect(formatNumber(0.07805756049913386)).toBe('0.07806');
  });

  it('writes very small and very large numbers as powers of ten', () => {
    expect(formatNumber(2.4999999999999998e-6)).toBe('2.5 × 10⁻⁶');
    // IAU 2015 Resolution B3: nominal solar mass parameter 1.3271244e20 m^3/s^2.
    expect(formatNumber(1.3271244e20, 10)).toBe('1.3271244 × 10²⁰');
    expect(formatNumber(1e6)).toBe('1 × 10⁶');
  });

  it('uses a minus sign, and a dash for what is not a number', () => {
    expect(formatNumber(-3.8505596)).toBe('−3.851');
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(Number.NaN)).toBe('—');
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe('—');
  });
});

describe('formatUnit', () => {
  it('writes powers as superscripts and micro as µ', () => {
    expect(formatUnit('m^2')).toBe('m²');
    expect(formatUnit('W/(m^2 K^4)')).toBe('W/(m² K⁴)');
    expect(formatUnit('m^3/s^2')).toBe('m³/s²');
    expect(formatUnit('um')).toBe('µm');
    expect(formatUnit('kg/m^3')).toBe('kg/m³');
    expect(formatUnit('m^(-1)')).toBe('m⁻¹');
  });

  it('writes percent, degrees and pure numbers as people read them', () => {
    expect(formatUnit('percent')).toBe('%');
    expect(formatUnit('deg')).toBe('°');
    expect(formatUnit('')).toBe('');
    expect(formatUnit('1')).toBe('');
  });
});

describe('formatQuantity', () => {
  it('joins value and unit, degrees without a space', () => {
    expect(formatQuantity(1600, 'm^2')).toBe('1600 m²');
    expect(formatQuantity(0.078, '')).toBe('0.078');
    expect(formatQuantity(35, 'deg')).toBe('35°');
  });

  it('gives an SI prefix instead of a power of ten to units that take one', () => {
    // 2.5 µm film (the template's thickness) as its conversion to metres leaves it.
    expect(formatQuantity(2.4999999999999998e-6, 'm')).toBe('2.5 µm');
    expect(formatQuantity(4.5e-4, 'N')).toBe('450 µN');
    expect(formatQuantity(3.2e7, 'W')).toBe('32 MW');
    // Fixed notation where it reads well, and no prefix on compound units.
    expect(formatQuantity(0.0058, 'N')).toBe('0.0058 N');
    expect(formatQuantity(2.5e-6, 'kg/m^2')).toBe('2.5 × 10⁻⁶ kg/m²');
  });
});

describe('editText', () => {
  it('gives back the digits typed, without conversion noise, in text that parses to the same number', () => {
    expect(editText(2.5)).toBe('2.5');
    expect(editText(1000 * 0.06)).toBe('60');
    expect(editText(0.30000000000000004)).toBe('0.3');
    expect(Number(editText(5.670374419e-8))).toBe(5.670374419e-8);
  });
});
