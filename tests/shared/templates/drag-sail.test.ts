import { evaluateCompiled } from '@/shared/engine/compile';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { sheetFunctions } from '@/shared/engine/functions';
import { US_STANDARD_1976_TABLE, VALLADO_EXPONENTIAL_TABLE } from '@/shared/sail/atmosphere-density';
import { RADIATION_PRESSURE_CAVEAT, SOLAR_CYCLE_CAVEAT, orbitalDecayTime } from '@/shared/sail/orbital-decay';
import { findTemplate, instantiateTemplate } from '@/shared/templates';

const template = findTemplate('drag-sail');
if (template === undefined) throw new Error('the drag-sail template is not registered');
const sheet = instantiateTemplate(template);
const km = 1000;
const year = 365.25 * 86_400;

function valuesOf(overrides: Record<string, number | string> = {}) {
  const result = evaluateSheet(sheet, overrides);
  expect(result.errors).toEqual([]);
  return (key: string): number => {
    const value = result.values[key]?.value;
    if (value === undefined) throw new Error(`no value for ${key}`);
    return value;
  };
}

describe('drag-sail template', () => {
  it('has every key the issue asks for, with a note and a source on every row', () => {
    const keys = sheet.parameters.map((parameter) => parameter.key);
    for (const key of [
      'craft_mass',
      'sail_area',
      'drag_coefficient',
      'start_altitude',
      'area_factor',
      'orbital_lifetime',
      'area_for_25_years',
      'area_for_5_years',
      'meets_25_year_rule',
      'meets_5_year_rule',
    ]) {
      expect(keys).toContain(key);
    }
    for (const parameter of sheet.parameters) {
      expect(parameter.note?.length ?? 0).toBeGreaterThan(20);
      expect(parameter.source?.length ?? 0).toBeGreaterThan(5);
    }
  });

  it('gives 5.24 years for 100 kg, C_D 2.2 and 10 m² held normal from 700 km', () => {
    // Worked value (Vallado 2013, Table 8-4 exponential atmosphere, circular decay to 100 km): 5.24 years.
    const value = valuesOf();
    expect(value('orbital_lifetime')).toBeCloseTo(5.24, 2);
    expect(value('ballistic_coefficient')).toBeCloseTo(100 / 22, 12);
  });

  it('computes the same figures in the live workbook and in the compiled evaluator', () => {
    const live = evaluateSheet(sheet, { density_model: 2, start_altitude: 550 });
    const compiled = evaluateCompiled(sheet, { density_model: 2, start_altitude: 550 });
    expect(compiled.errors).toEqual([]);
    for (const key of ['orbital_lifetime', 'area_for_25_years', 'area_for_5_years', 'meets_5_year_rule']) {
      expect(compiled.values[key]?.value).toBeCloseTo(live.values[key]?.value ?? Number.NaN, 10);
    }
  });

  it('finds the areas that bring the lifetime to 25 and 5 years', () => {
    // Independent of the sheet's proportion: the lifetime at the area the sheet gives, recomputed from the decay
    // integral with the ballistic coefficient of that area (Vallado 2013, §8.6), is the limit itself.
    const value = valuesOf({ start_altitude: 800 });
    const lifetimeAt = (area: number) => orbitalDecayTime(800 * km, 100 * km, 100 / (2.2 * area), VALLADO_EXPONENTIAL_TABLE) / year;
    expect(lifetimeAt(value('area_for_25_years'))).toBeCloseTo(25, 6);
    expect(lifetimeAt(value('area_for_5_years'))).toBeCloseTo(5, 6);
    expect(value('area_for_5_years') / value('area_for_25_years')).toBeCloseTo(5, 10);
  });

  it('says whether each rule is met', () => {
    // IADC-02-01: 25 years; FCC 22-74: 5 years. 5.24 years from 700 km meets the first, not the second.
    const at700 = valuesOf();
    expect([at700('meets_25_year_rule'), at700('meets_5_year_rule')]).toEqual([1, 0]);
    const larger = valuesOf({ sail_area: 12 });
    expect([larger('meets_25_year_rule'), larger('meets_5_year_rule')]).toEqual([1, 1]);
    const high = valuesOf({ start_altitude: 900 });
    expect(high('orbital_lifetime')).toBeGreaterThan(25);
    expect([high('meets_25_year_rule'), high('meets_5_year_rule')]).toEqual([0, 0]);
  });

  it('doubles the lifetime of a tumbling sail, whose mean projected area is half', () => {
    // Cauchy's formula: a convex body's mean projected area is a quarter of its surface, A/2 for a flat plate.
    expect(valuesOf({ area_factor: 0.5 })('orbital_lifetime') / valuesOf()('orbital_lifetime')).toBeCloseTo(2, 10);
  });

  it('switches to the U.S. Standard Atmosphere 1976 by its row', () => {
    const lifetime = valuesOf({ density_model: 2 })('orbital_lifetime');
    expect(lifetime).toBeCloseTo(orbitalDecayTime(700 * km, 100 * km, 100 / 22, US_STANDARD_1976_TABLE) / year, 10);
    expect(Math.abs(lifetime - valuesOf()('orbital_lifetime'))).toBeGreaterThan(0.1);
  });

  it('gives a row error, not a number, for a model it does not have or an altitude above the tables', () => {
    for (const overrides of [{ density_model: 3 }, { start_altitude: 1200 }] as Record<string, number>[]) {
      const result = evaluateSheet(sheet, overrides);
      expect(result.values.orbital_lifetime).toBeUndefined();
      expect(result.errors.find((error) => error.key === 'orbital_lifetime')?.code).toBe('invalid_value');
    }
  });

  it('refuses a lifetime formula that hands the function a wrong dimension', () => {
    const broken = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) =>
        parameter.key === 'orbital_lifetime'
          ? { ...parameter, formula: '=ORBITAL_LIFETIME(craft_mass, reentry_altitude, ballistic_coefficient, density_model)' }
          : parameter,
      ),
    };
    const error = evaluateSheet(broken).errors.find((candidate) => candidate.key === 'orbital_lifetime');
    expect(error?.code).toBe('dimension_mismatch');
    expect(error?.message).toMatch(/ORBITAL_LIFETIME needs argument 1/);
  });

  it('documents its lifetime function with the source of its relation', () => {
    expect(sheetFunctions.ORBITAL_LIFETIME?.source).toMatch(/Vallado 2013, §8\.6/);
  });

  it('shows the solar-cycle and radiation-pressure caveats and both rules as checks with every result', () => {
    expect(template.roles.caveats).toEqual([SOLAR_CYCLE_CAVEAT, RADIATION_PRESSURE_CAVEAT]);
    expect(template.roles.checks.map((check) => check.role)).toEqual(['meets_25_year_rule', 'meets_5_year_rule']);
    expect(template.roles.headline[0]).toBe('orbital_lifetime');
  });

  it('names no film by a trade name', () => {
    expect(JSON.stringify(sheet)).not.toMatch(/kapton|mylar|upilex|dupont/i);
  });
});
