import { evaluateSheet } from '@/shared/engine/evaluate';
import { parseUnit } from '@/shared/engine/units';
import { squareSailTemplate } from '@/shared/templates';
import { materialProperty, materials } from '@/shared/sail/materials';
import { REFERENCE_SAIL_OPTICS, UPDATED_SAIL_OPTICS_2015 } from '@/shared/sail/optics';

describe('materials library', () => {
  it('has unique ids and films, coatings, boom materials and optical sets', () => {
    const ids = materials.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(new Set(materials.map((m) => m.kind))).toEqual(new Set(['film', 'coating', 'boom', 'optical-set']));
  });

  it('names films by their generic material, never a trade name', () => {
    const text = JSON.stringify(materials);
    expect(text).not.toMatch(/kapton|mylar|upilex|dupont|teijin|melinex|apical/i);
  });

  it.each(materials.flatMap((m) => Object.entries(m.properties).map(([p, v]) => [m.id, p, v] as const)))(
    '%s %s has a source and a parseable unit',
    (_id, _property, value) => {
      expect(value?.source.length).toBeGreaterThan(10);
      if (value?.unit) expect(parseUnit(value.unit)).toMatchObject({ ok: true });
      expect(Number.isFinite(value?.value)).toBe(true);
    },
  );

  it('gives every material but an optical set a density in kg/m^3', () => {
    for (const material of materials.filter((m) => m.kind !== 'optical-set')) {
      expect(material.properties.density?.unit).toBe('kg/m^3');
    }
  });

  it('carries the handbook densities', () => {
    // PMDA-ODA polyimide film datasheet (from memory): 1.42 g/cm^3
    expect(materialProperty('polyimide', 'density')?.value).toBe(1420);
    // Biaxially oriented PET film datasheet (from memory): 1.39 g/cm^3
    expect(materialProperty('pet', 'density')?.value).toBe(1390);
    // CRC Handbook of Chemistry and Physics (from memory): aluminium 2.70 g/cm^3, chromium 7.15 g/cm^3 (the library
    // had 7.19 before, which is not the handbook's value)
    expect(materialProperty('aluminium', 'density')?.value).toBe(2700);
    expect(materialProperty('chromium', 'density')).toMatchObject({ value: 7150, source: expect.stringMatching(/CRC Handbook/) });
  });

  it('has film limits of about 400 °C for polyimide and 150 °C for PET', () => {
    // Polyimide and PET film datasheets (from memory)
    expect((materialProperty('polyimide', 'temperatureLimit')?.value ?? 0) - 273.15).toBeCloseTo(400, 6);
    expect((materialProperty('pet', 'temperatureLimit')?.value ?? 0) - 273.15).toBeCloseTo(150, 6);
  });

  it('gives polyimide a long-term limit of about 250 °C beside its short-term maximum of about 400 °C', () => {
    // Polyimide film datasheet, service life in air (from memory): about 8 years at 250 °C, about 12 hours at 400 °C.
    const shortTerm = materialProperty('polyimide', 'temperatureLimit');
    const longTerm = materialProperty('polyimide', 'longTermTemperatureLimit');
    expect(shortTerm?.source).toMatch(/short-term maximum/);
    expect((longTerm?.value ?? 0) - 273.15).toBeCloseTo(250, 6);
    expect(longTerm?.source).toMatch(/8 years at 250 °C/);
  });

  it('offers the 1999 reference optical set and the 2015 update side by side', () => {
    // McInnes 1999 after Wright 1992 (from memory): r 0.88, s 0.94, ε_f 0.05, ε_b 0.55, B_f 0.79, B_b 0.55.
    // Heaton & Artusio-Glimpse 2015, AIAA SPACE 2015 (from memory): r 0.91, s 0.94, ε_f 0.025, ε_b 0.27, B_f 0.79, B_b 0.67.
    const read = (id: string) =>
      ['reflectivity', 'specularFraction', 'emissivityFront', 'emissivityBack', 'nonLambertianFront', 'nonLambertianBack'].map(
        (property) => materialProperty(id, property)?.value,
      );
    expect(read('sail-optics-1999')).toEqual([0.88, 0.94, 0.05, 0.55, 0.79, 0.55]);
    expect(read('sail-optics-2015')).toEqual([0.91, 0.94, 0.025, 0.27, 0.79, 0.67]);
    expect(UPDATED_SAIL_OPTICS_2015.reflectivity).toBe(0.91);
    expect(materialProperty('sail-optics-2015', 'reflectivity')?.source).toMatch(/Heaton & Artusio-Glimpse 2015/);
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

  it('lets the film-limit row choose the short-term maximum or the long-term limit, the long-term one by default', () => {
    // Polyimide film datasheet (from memory): about 250 °C for years, about 400 °C for hours.
    const sheet = squareSailTemplate();
    const limitOf = (property: string) =>
      evaluateSheet({
        ...sheet,
        parameters: sheet.parameters.map((parameter) =>
          parameter.key === 'film_temperature_limit' ? { ...parameter, material: { id: 'polyimide', property } } : parameter,
        ),
      }).values.film_temperature_limit?.value;
    expect(evaluateSheet(sheet).values.film_temperature_limit?.value).toBeCloseTo(523.15, 10);
    expect(limitOf('longTermTemperatureLimit')).toBeCloseTo(523.15, 10);
    expect(limitOf('temperatureLimit')).toBeCloseTo(673.15, 10);
  });
});
