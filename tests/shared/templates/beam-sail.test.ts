import { SPEED_OF_LIGHT } from '@/shared/sail/constants';
import { describeTemplateRows, evaluateTemplateSI, siOf } from './template-sheet';

const c = SPEED_OF_LIGHT.value;

/**
 * Speed over c at a distance, by another route than the sheet function: d(gamma beta)/dt = (a0/c) F/F0 with
 * F/F0 = (1 - beta)[(1 - R) + 2R/(1 + beta)]/(1 + R), integrated in time with classical Runge-Kutta.
 */
function betaByTimeIntegration(a0: number, distance: number, reflectivity: number): number {
  const ratio = (beta: number) => ((1 - beta) * (1 - reflectivity + (2 * reflectivity) / (1 + beta))) / (1 + reflectivity);
  const betaOf = (u: number) => u / Math.sqrt(1 + u * u);
  const derivative = (u: number) => [(a0 / c) * ratio(betaOf(u)), betaOf(u) * c] as const;
  let [u, x] = [0, 0];
  const dt = Math.sqrt((2 * distance) / a0) / 20_000;
  for (;;) {
    const [k1u, k1x] = derivative(u);
    const [k2u, k2x] = derivative(u + (dt / 2) * k1u);
    const [k3u, k3x] = derivative(u + (dt / 2) * k2u);
    const [k4u, k4x] = derivative(u + dt * k3u);
    const next = u + (dt / 6) * (k1u + 2 * k2u + 2 * k3u + k4u);
    const nextX = x + (dt / 6) * (k1x + 2 * k2x + 2 * k3x + k4x);
    if (nextX >= distance) return betaOf(u + ((next - u) * (distance - x)) / (nextX - x));
    [u, x] = [next, nextX];
  }
}

describe('beam-sail template', () => {
  describeTemplateRows(
    'beam-sail',
    { beam_power: 'GW', array_diameter: 'm', wavelength: 'um', sail_diameter: 'm', craft_mass: 'g', sail_reflectivity: '' },
    {
      beam_acceleration: 'm/s^2',
      diffraction_distance: 'm',
      speed_at_diffraction_distance: '',
      speed_at_diffraction_distance_relativistic: '',
    },
  );

  // The worked case: 100 GW, 1 km array, 1.064 um, 4 m sail, 1 g, R 1.
  const worked = { beam_power: 100, array_diameter: 1000, wavelength: 1.064, sail_diameter: 4, craft_mass: 1, sail_reflectivity: 1 };

  // Forward 1984, J. Spacecraft Rockets 21(2) (from memory): a = (1 + R) P / (m c) = 6.67e5 m/s^2;
  // Lubin 2016, JBIS 69 (from memory): L0 = d D / (2 lambda) = 1.88e9 m and v0 = sqrt(2 a L0) = 0.167 c.
  it('gives the acceleration, diffraction distance and non-relativistic speed of the worked case', () => {
    const values = evaluateTemplateSI('beam-sail', worked);
    expect(siOf(values, 'beam_acceleration') / 6.67e5).toBeCloseTo(1, 3);
    expect(siOf(values, 'diffraction_distance') / 1.88e9).toBeCloseTo(1, 2);
    expect(siOf(values, 'speed_at_diffraction_distance')).toBeCloseTo(0.167, 3);
  });

  // Forward 1984 (from memory) for the force at rest, and the Doppler-thinned force on a receding mirror, integrated
  // here in time (Runge-Kutta) rather than in speed as the sheet function does.
  it.each([1, 0.9, 0.5])('gives the relativistic speed at the diffraction distance with reflectivity %s', (reflectivity) => {
    const values = evaluateTemplateSI('beam-sail', { ...worked, sail_reflectivity: reflectivity });
    const expected = betaByTimeIntegration(siOf(values, 'beam_acceleration'), siOf(values, 'diffraction_distance'), reflectivity);
    expect(siOf(values, 'speed_at_diffraction_distance_relativistic')).toBeCloseTo(expected, 5);
    expect(siOf(values, 'speed_at_diffraction_distance_relativistic')).toBeLessThan(siOf(values, 'speed_at_diffraction_distance'));
  });

  // At low speed the relativistic result meets sqrt(2 a L0) / c (the Doppler factor tends to 1).
  it('meets the non-relativistic speed for a slow sail', () => {
    const values = evaluateTemplateSI('beam-sail', { ...worked, beam_power: 0.001 });
    expect(siOf(values, 'speed_at_diffraction_distance_relativistic') / siOf(values, 'speed_at_diffraction_distance')).toBeCloseTo(1, 3);
  });
});
