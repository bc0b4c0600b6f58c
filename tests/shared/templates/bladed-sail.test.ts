import { describeTemplateRows, evaluateTemplateSI, siOf } from './template-sheet';

const rpm = (2 * Math.PI) / 60;

describe('bladed-sail template', () => {
  describeTemplateRows(
    'bladed-sail',
    {
      blade_count: '',
      blade_length: 'm',
      blade_width: 'm',
      hub_radius: 'm',
      film_thickness: 'um',
      film_density: 'kg/m^3',
      tip_mass: 'kg',
      spin_rate: 'rpm',
      film_allowable_stress: 'MPa',
      sail_efficiency: '',
      distance: 'AU',
    },
    { sail_area: 'm^2', root_tension: 'N', root_slope: 'deg', tip_speed: 'm/s', tip_speed_limit: 'm/s' },
  );

  // The worked case: 6 blades 200 m x 1 m, 2.5 um film at 1420 kg/m^3, 0.1 kg tips, hub 0.5 m, 1 rpm, ideal sail at 1 AU.
  const worked = {
    blade_count: 6,
    blade_length: 200,
    blade_width: 1,
    hub_radius: 0.5,
    film_thickness: 2.5,
    film_density: 1420,
    tip_mass: 0.1,
    spin_rate: 1,
    sail_efficiency: 1,
    distance: 1,
  };

  // MacNeal 1967, NASA CR-84460 (from memory): worked root tension 1.00 N and root slope 0.104 deg.
  it('gives the root tension and root slope of the worked case', () => {
    const values = evaluateTemplateSI('bladed-sail', worked);
    expect(siOf(values, 'sail_area')).toBeCloseTo(1200, 9);
    expect(siOf(values, 'root_tension')).toBeCloseTo(1.0, 2);
    expect((siOf(values, 'root_slope') * 180) / Math.PI).toBeCloseTo(0.104, 3);
  });

  // MacNeal 1967 (from memory), by another route: the root carries the centrifugal pull of every strip of film
  // outboard of it, sigma_A w w^2 r dr summed numerically from the root to the tip, plus the tip mass's m_t w^2 R.
  it('gives the root tension as the summed centrifugal pull of the blade', () => {
    const values = evaluateTemplateSI('bladed-sail', worked);
    const [sigma, w, omega, root, tip] = [2.5e-6 * 1420, 1, rpm, 0.5, 200.5];
    const steps = 4000;
    const h = (tip - root) / steps;
    let tension = 0.1 * omega ** 2 * tip;
    for (let k = 0; k < steps; k += 1) tension += sigma * w * omega ** 2 * (root + (k + 0.5) * h) * h;
    expect(siOf(values, 'root_tension') / tension).toBeCloseTo(1, 9);
  });

  // Kinematics, and MacNeal 1967 (from memory): the root film stress rho w^2 (R^2 - r_h^2)/2 reaches the allowable
  // at the tip-speed limit sqrt(2 s / rho) when the hub is small.
  it('gives the tip speed and the limit at which the film root stress reaches the allowable', () => {
    const values = evaluateTemplateSI('bladed-sail', { ...worked, hub_radius: 0, film_allowable_stress: 20 });
    expect(siOf(values, 'tip_speed')).toBeCloseTo(rpm * 200, 9);
    const limit = siOf(values, 'tip_speed_limit');
    const omegaAtLimit = limit / 200;
    expect((1420 * omegaAtLimit ** 2 * 200 ** 2) / 2).toBeCloseTo(20e6, 3);
    expect(siOf(values, 'tip_speed_within_limit')).toBe(1);
    const tooFast = evaluateTemplateSI('bladed-sail', { ...worked, hub_radius: 0, spin_rate: `${omegaAtLimit * 1.01} rad/s` });
    expect(siOf(tooFast, 'tip_speed_within_limit')).toBe(0);
  });

  // Tensioned string (MacNeal 1967, from memory): the slope scales as p / T, so twice the spin gives a quarter.
  it('flattens the blades as the square of the spin', () => {
    const noTip = { ...worked, tip_mass: 0 };
    const slow = siOf(evaluateTemplateSI('bladed-sail', noTip), 'root_slope');
    const fast = siOf(evaluateTemplateSI('bladed-sail', { ...noTip, spin_rate: 2 }), 'root_slope');
    expect(Math.tan(fast) / Math.tan(slow)).toBeCloseTo(0.25, 9);
  });
});
