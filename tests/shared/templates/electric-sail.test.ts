import { describeTemplateRows, elementaryCharge, evaluateTemplateSI, protonMass, siOf } from './template-sheet';

// CODATA 2018.
const epsilon0 = 8.8541878128e-12;

describe('electric-sail template', () => {
  describeTemplateRows(
    'electric-sail',
    {
      tether_count: '',
      tether_length: 'km',
      tether_voltage: 'kV',
      solar_wind_density: '1/cm^3',
      solar_wind_speed: 'km/s',
      distance: 'AU',
      craft_mass: 'kg',
    },
    { thrust_per_length: 'nN/m', thrust: 'N', characteristic_acceleration: 'mm/s^2' },
  );

  // The worked case: n 7.3 cm^-3, v 400 km/s, 20 kV at 1 AU; 100 tethers of 20 km on a 1000 kg craft.
  const worked = {
    solar_wind_density: 7.3,
    solar_wind_speed: 400,
    tether_voltage: 20,
    tether_count: 100,
    tether_length: 20,
    craft_mass: 1000,
  };

  // Janhunen et al. 2010, Rev. Sci. Instrum. 81, 111301 (from memory): P_dyn 1.95 nPa, V1 835 V, about 454 nN/m.
  it('gives the dynamic pressure, stopping voltage and thrust per length of the worked case', () => {
    const values = evaluateTemplateSI('electric-sail', worked);
    expect(siOf(values, 'dynamic_pressure') / 1.95e-9).toBeCloseTo(1, 2);
    expect(siOf(values, 'proton_stopping_voltage')).toBeCloseTo(835, 0);
    expect(siOf(values, 'thrust_per_length') / 454e-9).toBeCloseTo(1, 2);
    // The same relation worked here from the constants: 0.18 (V0 - m_p v^2 / 2e) sqrt(eps0 m_p n v^2).
    const v = 400e3;
    const perLength = 0.18 * (20e3 - (protonMass * v ** 2) / (2 * elementaryCharge)) * Math.sqrt(epsilon0 * protonMass * 7.3e6 * v ** 2);
    expect(siOf(values, 'thrust_per_length') / perLength).toBeCloseTo(1, 9);
  });

  // Janhunen 2009, Ann. Geophys. 27 (from memory): the thrust falls as 1/r; characteristic acceleration at 1 AU.
  it('gives the thrust at distance and the characteristic acceleration', () => {
    const values = evaluateTemplateSI('electric-sail', worked);
    const atOneAu = siOf(values, 'thrust_per_length') * 100 * 20e3;
    expect(siOf(values, 'thrust')).toBeCloseTo(atOneAu, 12);
    expect(siOf(evaluateTemplateSI('electric-sail', { ...worked, distance: 2 }), 'thrust')).toBeCloseTo(atOneAu / 2, 12);
    expect(siOf(evaluateTemplateSI('electric-sail', { ...worked, distance: 2 }), 'characteristic_acceleration')).toBeCloseTo(
      atOneAu / 1000,
      12,
    );
  });

  // Janhunen et al. 2010 (from memory): no thrust below the voltage that stops a proton.
  it('gives no thrust below the proton stopping voltage', () => {
    expect(siOf(evaluateTemplateSI('electric-sail', { ...worked, tether_voltage: 0.5 }), 'thrust')).toBe(0);
  });
});
