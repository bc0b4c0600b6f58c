import { templateChecks } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { instantiateTemplate } from '@/shared/templates';
import { describeTemplateRows, elementaryCharge, evaluateTemplateSI, protonMass, siOf, templateById } from './template-sheet';

// CODATA 2018.
const mu0 = 1.25663706212e-6;

describe('magnetic-sail template', () => {
  describeTemplateRows(
    'magnetic-sail',
    {
      loop_radius: 'km',
      loop_current: 'kA',
      solar_wind_density: '1/cm^3',
      solar_wind_speed: 'km/s',
      drag_coefficient: '',
      wire_density: 'kg/m^3',
      current_density: 'A/m^2',
    },
    {
      magnetic_moment: 'A m^2',
      standoff_distance: 'km',
      thrust: 'N',
      standoff_ratio: '',
      gyroradius_ratio: '',
      loop_mass: 'kg',
    },
  );

  // The worked case: R 50 km, I 50 kA, n 5 cm^-3, v 400 km/s.
  const worked = { loop_radius: 50, loop_current: 50, solar_wind_density: 5, solar_wind_speed: 400 };

  // Zubrin & Andrews 1991, J. Spacecraft Rockets 28(2) (from memory): r_mp 111 km (2.2 R), F 51 to 93 N for C_d 2 to 3.6.
  it('gives the stand-off and thrust of the worked case', () => {
    const low = evaluateTemplateSI('magnetic-sail', { ...worked, drag_coefficient: 2 });
    expect(siOf(low, 'magnetic_moment')).toBeCloseTo(50e3 * Math.PI * 50e3 ** 2, 0);
    expect(siOf(low, 'standoff_distance') / 111e3).toBeCloseTo(1, 2);
    expect(siOf(low, 'standoff_ratio')).toBeCloseTo(2.2, 1);
    expect(siOf(low, 'thrust')).toBeCloseTo(51.5, 0);
    expect(siOf(evaluateTemplateSI('magnetic-sail', { ...worked, drag_coefficient: 3.6 }), 'thrust')).toBeCloseTo(92.6, 0);
  });

  // Zubrin & Andrews 1991 (from memory), by another route: the stand-off balances the wind's pressure rho v^2
  // against the compressed field's pressure (2 B_dipole)^2 / (2 mu0), B_dipole = mu0 m / (4 pi r^3).
  it('puts the stand-off where the compressed field pressure meets the wind pressure', () => {
    const values = evaluateTemplateSI('magnetic-sail', worked);
    const r = siOf(values, 'standoff_distance');
    const field = (2 * mu0 * siOf(values, 'magnetic_moment')) / (4 * Math.PI * r ** 3);
    expect(field ** 2 / (2 * mu0) / (protonMass * 5e6 * 400e3 ** 2)).toBeCloseTo(1, 9);
    // The proton gyroradius m_p v / (e B) in that field.
    expect(siOf(values, 'gyroradius_ratio')).toBeCloseTo((protonMass * 400e3) / (elementaryCharge * field) / r, 9);
  });

  // Zubrin & Andrews 1991 (from memory): F scales as r^(-4/3) with heliocentric distance (n as 1/r^2, v constant).
  it('scales the thrust as the distance to the power -4/3', () => {
    const near = siOf(evaluateTemplateSI('magnetic-sail', worked), 'thrust');
    const far = siOf(evaluateTemplateSI('magnetic-sail', { ...worked, solar_wind_density: 5 / 4 }), 'thrust');
    expect(far / near).toBeCloseTo(2 ** (-4 / 3), 9);
  });

  // Geometry: wire length 2 pi R times the cross-section I / J.
  it('gives the loop mass', () => {
    const values = evaluateTemplateSI('magnetic-sail', { ...worked, wire_density: 8900, current_density: 1e10 });
    expect(siOf(values, 'loop_mass')).toBeCloseTo(8900 * 2 * Math.PI * 50e3 * (50e3 / 1e10), 6);
  });

  it('says beside the thrust that the worked case is outside the far field and the fluid regime', () => {
    const sheet = instantiateTemplate(templateById('magnetic-sail'));
    const checks = templateChecks(sheet, evaluateSheet(sheet, worked));
    expect(checks.map((check) => [check.role, check.status, check.beside])).toEqual([
      ['far_field_holds', 'fails', 'thrust'],
      ['fluid_regime_holds', 'fails', 'thrust'],
    ]);
    // The field at the stand-off is set by the wind (B^2 / 2 mu0 = rho v^2), so the gyroradius is fixed (about 72 km):
    // a hundred times the moment puts the stand-off at about 515 km, over 10 loop radii and 7 gyroradii.
    const strong = templateChecks(sheet, evaluateSheet(sheet, { ...worked, loop_current: 5000 }));
    expect(strong.map((check) => check.status)).toEqual(['holds', 'holds']);
  });
});
