import { Body, C_AUDAY, KM_PER_AU, MassProduct } from 'astronomy-engine';
import { unit } from 'mathjs';
import {
  ASTRONOMICAL_UNIT,
  EARTH_GM,
  EARTH_RADIUS,
  physicalConstants,
  SOLAR_GM,
  SOLAR_IRRADIANCE_1AU,
  SPEED_OF_LIGHT,
  STEFAN_BOLTZMANN,
} from '@/shared/sail/constants';

describe('physical constants', () => {
  it('carry the published values', () => {
    // IAU 2015 Resolution B3: nominal solar irradiance 1361 W/m^2
    expect(SOLAR_IRRADIANCE_1AU.value).toBe(1361);
    // SI definition: c = 299 792 458 m/s exactly
    expect(SPEED_OF_LIGHT.value).toBe(299_792_458);
    // IAU 2012 Resolution B2: 1 au = 149 597 870 700 m exactly
    expect(ASTRONOMICAL_UNIT.value).toBe(149_597_870_700);
    // IAU 2015 Resolution B3: nominal GM_sun = 1.3271244e20 m^3/s^2
    expect(SOLAR_GM.value).toBe(1.3271244e20);
    // CODATA 2018: σ = 5.670374419e-8 W m^-2 K^-4
    expect(STEFAN_BOLTZMANN.value).toBe(5.670374419e-8);
    // WGS 84: GM = 3.986004418e14 m^3/s^2, a = 6 378 137 m
    expect(EARTH_GM.value).toBe(3.986004418e14);
    expect(EARTH_RADIUS.value).toBe(6_378_137);
  });

  it('agree with astronomy-engine on the astronomical unit', () => {
    // astronomy-engine KM_PER_AU (its own rounding of the IAU value) to 1e-9
    expect(ASTRONOMICAL_UNIT.value / 1000 / KM_PER_AU).toBeCloseTo(1, 9);
  });

  it('agree with astronomy-engine on the speed of light', () => {
    // astronomy-engine C_AUDAY: speed of light in AU per day
    const cFromEngine = (C_AUDAY * KM_PER_AU * 1000) / 86_400;
    expect(SPEED_OF_LIGHT.value / cFromEngine).toBeCloseTo(1, 9);
  });

  it('agree with astronomy-engine on the solar and Earth gravitational parameters', () => {
    // astronomy-engine MassProduct: GM in au^3/day^2 (its ephemeris values)
    const toSI = Math.pow(KM_PER_AU * 1000, 3) / (86_400 * 86_400);
    expect((MassProduct(Body.Sun) * toSI) / SOLAR_GM.value).toBeCloseTo(1, 8);
    expect((MassProduct(Body.Earth) * toSI) / EARTH_GM.value).toBeCloseTo(1, 6);
  });

  it.each(Object.entries(physicalConstants))('%s has a source and a unit mathjs parses', (_name, constant) => {
    expect(constant.source.length).toBeGreaterThan(5);
    expect(() => unit(constant.unit)).not.toThrow();
  });

  it('state units of the right dimension', () => {
    expect(unit(SOLAR_IRRADIANCE_1AU.unit).equalBase(unit('W/m^2'))).toBe(true);
    expect(unit(STEFAN_BOLTZMANN.unit).equalBase(unit('W m^-2 K^-4'))).toBe(true);
    expect(unit(SOLAR_GM.unit).equalBase(unit('m^3 s^-2'))).toBe(true);
  });
});
