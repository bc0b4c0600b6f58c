import { unit } from 'mathjs';
import { materialProperty, materials } from '@/shared/sail/materials';
import { REFERENCE_SAIL_OPTICS } from '@/shared/sail/optics';

describe('materials library', () => {
  it('has unique ids and films, coatings and boom materials', () => {
    const ids = materials.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(new Set(materials.map((m) => m.kind))).toEqual(new Set(['film', 'coating', 'boom']));
  });

  it.each(materials.flatMap((m) => Object.entries(m.properties).map(([p, v]) => [m.id, p, v] as const)))(
    '%s %s has a source and a parseable unit',
    (_id, _property, value) => {
      expect(value?.source.length).toBeGreaterThan(10);
      if (value?.unit) expect(() => unit(value.unit)).not.toThrow();
      expect(Number.isFinite(value?.value)).toBe(true);
    },
  );

  it('gives every material a density in kg/m^3', () => {
    for (const material of materials) {
      expect(material.properties.density?.unit).toBe('kg/m^3');
    }
  });

  it('carries the handbook densities', () => {
    // DuPont Kapton HN datasheet (from memory): 1.42 g/cm^3
    expect(materialProperty('polyimide', 'density')?.value).toBe(1420);
    // DuPont Teijin Mylar datasheet (from memory): 1.39 g/cm^3
    expect(materialProperty('pet', 'density')?.value).toBe(1390);
    // CRC Handbook (from memory): aluminium 2.70 g/cm^3, chromium 7.19 g/cm^3
    expect(materialProperty('aluminium', 'density')?.value).toBe(2700);
    expect(materialProperty('chromium', 'density')?.value).toBe(7190);
  });

  it('has film limits of about 400 °C for polyimide and 150 °C for PET', () => {
    // Kapton HN and Mylar datasheets (from memory)
    expect((materialProperty('polyimide', 'temperatureLimit')?.value ?? 0) - 273.15).toBeCloseTo(400, 6);
    expect((materialProperty('pet', 'temperatureLimit')?.value ?? 0) - 273.15).toBeCloseTo(150, 6);
  });

  it('gives the coatings the tabulated optical coefficients', () => {
    // McInnes 1999 after Wright 1992 (from memory): aluminium front r 0.88, ε 0.05; chromium back ε 0.55
    expect(materialProperty('aluminium', 'reflectivity')?.value).toBe(REFERENCE_SAIL_OPTICS.reflectivity);
    expect(materialProperty('aluminium', 'emissivity')?.value).toBe(0.05);
    expect(materialProperty('chromium', 'emissivity')?.value).toBe(0.55);
  });

  it('answers undefined for an unknown material or property', () => {
    expect(materialProperty('unobtainium', 'density')).toBeUndefined();
    expect(materialProperty('cfrp', 'reflectivity')).toBeUndefined();
    expect(materialProperty('cfrp', 'toString')).toBeUndefined();
  });
});
