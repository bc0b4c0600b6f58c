import { rollUpBudget } from '@/shared/budget/rollup';
import { findPreset } from '@/shared/budget/presets';
import { evaluateSheet } from '@/shared/engine/evaluate';
import {
  ASTRONOMICAL_UNIT,
  SOLAR_GM,
  SOLAR_IRRADIANCE_1AU,
  SPEED_OF_LIGHT,
  STEFAN_BOLTZMANN,
  type PhysicalConstant,
} from '@/shared/sail/constants';
import { squareSailTemplate } from '@/shared/templates';

const sheet = squareSailTemplate();

function valueOf(key: string, overrides: Record<string, number | string> = {}): number {
  const result = evaluateSheet(sheet, overrides);
  expect(result.errors).toEqual([]);
  const value = result.values[key]?.value;
  if (value === undefined) throw new Error(`no value for ${key}`);
  return value;
}

describe('square-sail template', () => {
  it('evaluates with no errors', () => {
    expect(evaluateSheet(sheet).errors).toEqual([]);
  });

  it('has every required key, a note on every row and a visible formula on every output', () => {
    const keys = sheet.parameters.map((parameter) => parameter.key);
    const inputs = [
      'sail_side',
      'film_thickness',
      'film_density',
      'front_coating_thickness',
      'front_coating_density',
      'back_coating_thickness',
      'back_coating_density',
      'boom_count',
      'boom_linear_density',
      'deployer_mass',
      'bus_mass',
      'payload_mass',
      'sail_efficiency',
      'distance',
      'cone_angle',
      'reflectivity',
      'specular_fraction',
      'emissivity_front',
      'emissivity_back',
      'nonlambertian_front',
      'nonlambertian_back',
      'mass_allocation',
      'film_temperature_limit',
    ];
    const outputs = [
      'sail_area',
      'membrane_mass',
      'boom_length',
      'boom_mass',
      'total_mass',
      'predicted_mass',
      'areal_density',
      'characteristic_acceleration',
      'lightness_number',
      'srp_force',
      'srp_force_optical',
      'srp_force_normal',
      'srp_force_transverse',
      'srp_force_circumferential',
      'sail_temperature',
      'system_margin',
    ];
    expect(keys).toEqual(expect.arrayContaining([...inputs, ...outputs]));
    for (const parameter of sheet.parameters) expect(parameter.note).toMatch(/\S/);
    for (const key of outputs) expect(sheet.parameters.find((p) => p.key === key)?.formula).toMatch(/^=/);
  });

  it.each<[string, PhysicalConstant]>([
    ['solar_irradiance_1au', SOLAR_IRRADIANCE_1AU],
    ['speed_of_light', SPEED_OF_LIGHT],
    ['astronomical_unit', ASTRONOMICAL_UNIT],
    ['solar_gm', SOLAR_GM],
    ['stefan_boltzmann', STEFAN_BOLTZMANN],
  ])('holds the constant %s as shared/sail/constants gives it, protected and sourced', (key, constant) => {
    const row = sheet.parameters.find((parameter) => parameter.key === key);
    expect(row).toMatchObject({
      value: constant.value,
      unit: constant.unit,
      source: constant.source,
      protected: true,
      subsystem: 'Constants',
    });
  });

  // McInnes 1999, Solar Sailing, ch. 2: P = S0/c = 4.54e-6 N/m^2 at 1 AU (S0 = 1361 W/m^2, IAU 2015 Resolution B3).
  it('gives the solar radiation pressure at 1 AU', () => {
    expect(valueOf('solar_pressure_1au')).toBeCloseTo(4.54e-6, 8);
    // Inverse-square law: a quarter at 2 AU.
    expect(valueOf('solar_pressure', { distance: 2 })).toBeCloseTo(4.54e-6 / 4, 8);
  });

  // McInnes 1999, Solar Sailing, ch. 2: critical sail loading sigma* = 1.53 g/m^2.
  it('gives the critical sail loading', () => {
    expect(valueOf('critical_sail_loading')).toBeCloseTo(1.53, 2);
  });

  // McInnes 1999, Solar Sailing, ch. 2: g0 = GM_sun / AU^2 = 5.93e-3 m/s^2.
  it('gives the solar gravity at 1 AU', () => {
    expect(valueOf('solar_gravity_1au')).toBeCloseTo(5.93, 2);
  });

  // McInnes 1999 ch. 2 (from memory): F_n(0) / (2 P A) = 0.908 with r = 0.88, s = 0.94, eps_f = 0.05,
  // eps_b = 0.55, B_f = 0.79, B_b = 0.55 (the tabulated coefficients, here from the materials library).
  it('gives the optical model efficiency with the tabulated coefficients', () => {
    const force = valueOf('srp_force_normal');
    const ideal = 2 * valueOf('solar_pressure') * valueOf('sail_area');
    expect(force / ideal).toBeCloseTo(0.908, 3);
    expect(valueOf('srp_force_transverse')).toBe(0);
  });

  // McInnes 1999 ch. 2: F_t = P A (1 - r s) cos(alpha) sin(alpha); at 45 deg, P A (1 - r s) / 2.
  it('splits the optical force into normal and transverse components at a cone angle', () => {
    const pa = valueOf('solar_pressure') * valueOf('sail_area');
    const transverse = valueOf('srp_force_transverse', { cone_angle: 45 });
    expect(transverse).toBeCloseTo((pa * (1 - 0.88 * 0.94)) / 2, 12);
    const normal = valueOf('srp_force_normal', { cone_angle: 45 });
    expect(valueOf('srp_force_optical', { cone_angle: 45 })).toBeCloseTo(Math.hypot(normal, transverse), 12);
  });

  // McInnes 1999 ch. 2: radiative equilibrium temperature with the tabulated coefficients at 1 AU, facing the sun: about 263 K.
  it('gives the sail temperature', () => {
    expect(valueOf('sail_temperature')).toBeCloseTo(263, 0);
    // T scales as r^-1/2 (same formula): at 0.5 AU, sqrt(2) times hotter.
    expect(valueOf('sail_temperature', { distance: 0.5 })).toBeCloseTo(263.22 * Math.SQRT2, 0);
  });

  // Common practice: an 800 m x 800 m sail at 1 AU facing the sun feels about 5 N; ideal 5.8 N, about 5.2 N at eta = 0.9.
  it('gives the force on an 800 m square sail', () => {
    expect(valueOf('srp_force', { sail_side: '800 m', sail_efficiency: 1 })).toBeCloseTo(5.8, 1);
    expect(valueOf('srp_force', { sail_side: '0.8 km', sail_efficiency: 0.9 })).toBeCloseTo(5.2, 1);
    // Ideal flat sail, McInnes 1999 ch. 2: F = 2 P A cos^2(alpha), half at 45 deg.
    expect(valueOf('srp_force', { sail_side: 800, sail_efficiency: 1, cone_angle: '45 deg' })).toBeCloseTo(5.81 / 2, 2);
  });

  it('derives lightness number and characteristic acceleration from the areal density (McInnes 1999 ch. 2)', () => {
    const sigma = valueOf('areal_density') / 1000;
    const ac = (2 * 0.9 * (1361 / 299_792_458)) / sigma;
    expect(valueOf('characteristic_acceleration')).toBeCloseTo(ac * 1000, 10);
    expect(valueOf('lightness_number')).toBeCloseTo(ac / (1.3271244e20 / 149_597_870_700 ** 2), 10);
    expect(valueOf('areal_density')).toBeCloseTo((valueOf('predicted_mass') / valueOf('sail_area')) * 1000, 10);
  });

  // McInnes 1999 ch. 2: with r = s = 1 the optical model is the ideal sail, F = 2 P A cos^2(alpha), all along the normal.
  it('reduces the optical force to the ideal sail for a perfect specular reflector', () => {
    for (const cone_angle of [0, 20, 45, 70]) {
      const perfect = { reflectivity: 1, specular_fraction: 1, sail_efficiency: 1, cone_angle };
      expect(valueOf('srp_force_normal', perfect)).toBeCloseTo(valueOf('srp_force', perfect), 15);
      expect(valueOf('srp_force_transverse', perfect)).toBeCloseTo(0, 15);
    }
  });

  // McInnes 1999 ch. 2: a_c = 2 eta P / sigma; 9.08e-6 N/m^2 on 10 g/m^2 gives 0.908 mm/s^2.
  it('gives the characteristic acceleration of a 10 g/m^2 ideal sail', () => {
    expect(valueOf('characteristic_acceleration', { areal_density: 10, sail_efficiency: 1 })).toBeCloseTo(0.908, 3);
  });

  // McInnes 1999 ch. 2: beta = 1 at the critical sail loading sigma*.
  it('gives a lightness number of 1 at the critical sail loading', () => {
    const critical = valueOf('critical_sail_loading');
    expect(valueOf('lightness_number', { areal_density: critical, sail_efficiency: 1 })).toBeCloseTo(1, 12);
  });

  // McInnes 1999 ch. 2: T is proportional to (cos(alpha) / r^2)^(1/4).
  it('scales the temperature with the cone angle as cos^(1/4)', () => {
    expect(valueOf('sail_temperature', { cone_angle: 60 })).toBeCloseTo(valueOf('sail_temperature') * Math.pow(0.5, 0.25), 9);
    expect(valueOf('sail_temperature', { distance: 0.25 })).toBeCloseTo(2 * valueOf('sail_temperature'), 9);
  });

  // McInnes 1999 ch. 2 (flat-sail geometry): the force across the sun line is F_n sin(alpha) - F_t cos(alpha), 0 facing the sun.
  it('gives the force across the sun line', () => {
    expect(valueOf('srp_force_circumferential')).toBeCloseTo(0, 15);
    const normal = valueOf('srp_force_normal', { cone_angle: 30 });
    const transverse = valueOf('srp_force_transverse', { cone_angle: 30 });
    expect(valueOf('srp_force_circumferential', { cone_angle: 30 })).toBeCloseTo(normal * 0.5 - transverse * Math.cos(Math.PI / 6), 15);
  });

  // Was 673.15 K, the datasheet's short-term maximum (about 400 degC), which a sail in sunlight for years must not be held to.
  it("takes the film's long-term temperature limit from the materials library (polyimide film datasheet, from memory: about 250 degC)", () => {
    expect(valueOf('film_temperature_limit')).toBeCloseTo(523.15, 10);
  });

  it('sizes the membrane and booms from the geometry', () => {
    // Film 2.5 um x 1420 kg/m^3, aluminium 100 nm x 2700 kg/m^3, chromium 15 nm x 7150 kg/m^3 (CRC Handbook, from memory;
    // the library had 7190, which is not the handbook's value).
    expect(valueOf('membrane_mass')).toBeCloseTo(1600 * (2.5e-6 * 1420 + 100e-9 * 2700 + 15e-9 * 7150), 10);
    expect(valueOf('boom_length')).toBeCloseTo(40 / Math.SQRT2, 10);
    expect(valueOf('boom_mass')).toBeCloseTo(4 * (40 / Math.SQRT2) * 0.02, 10);
  });

  it('computes predicted mass and system margin as the budget roll-up does', () => {
    const { values } = evaluateSheet(sheet);
    const preset = findPreset('aiaa-s120a');
    if (preset === undefined) throw new Error('preset missing');
    const rows = sheet.parameters.flatMap((parameter) =>
      parameter.mass === undefined
        ? []
        : [{ key: parameter.key, subsystem: parameter.subsystem, cbe: values[parameter.key]?.value ?? Number.NaN, ...parameter.mass }],
    );
    const rollUp = rollUpBudget(rows, preset, { allocation: 35, requiredMarginPercent: 15 });
    expect(values.total_mass?.value).toBeCloseTo(rollUp.total.cbe, 10);
    expect(values.predicted_mass?.value).toBeCloseTo(rollUp.total.predicted, 10);
    expect(values.system_margin?.value).toBeCloseTo(rollUp.systemMargin.kg, 10);
    expect(values.system_margin_percent?.value).toBeCloseTo(rollUp.systemMargin.percentOfAllocation, 10);
  });

  it('follows the allowance preset: the ESA preset gives 20 % on new designs (ESA SRE-PA/2011.097)', () => {
    const esa = {
      ...sheet,
      budget: { preset: 'esa-margin' },
      parameters: sheet.parameters.map((parameter) =>
        parameter.mass === undefined ? parameter : { ...parameter, mass: { maturity: 'new_design', category: parameter.mass.category } },
      ),
    };
    const { values, errors } = evaluateSheet(esa);
    expect(errors).toEqual([]);
    expect(values.predicted_mass?.value).toBeCloseTo((values.total_mass?.value ?? 0) * 1.2, 10);
  });
});
