import type { CliEvaluation } from '@/shared/schemas/cli';
import { templates } from '@/shared/templates';
import { runEvaluate } from '../helpers/cli';

const evaluate = (...args: string[]) => runEvaluate<CliEvaluation>(...args);

jest.setTimeout(60_000);

describe('npm run evaluate -- --template ID', () => {
  it.each(templates.map((template) => [template.id, template] as const))('evaluates %s with every headline figure', (id, template) => {
    const { status, output } = evaluate('--template', id);
    expect(output.errors).toEqual([]);
    expect(status).toBe(0);
    for (const role of template.roles.headline) {
      const key = template.roles.rows[role] ?? role;
      expect({ key, finite: Number.isFinite(output.values[key]?.value) }).toEqual({ key, finite: true });
    }
  });

  // The worked cases, as the templates' own tests check them, through the command line.
  it.each([
    // Zubrin & Andrews 1991, J. Spacecraft Rockets 28(2) (from memory): r_mp 111 km for R 50 km, I 50 kA, n 5 cm^-3.
    ['magnetic-sail', ['loop_radius=50 km', 'loop_current=50 kA'], 'standoff_distance', 111, 0],
    // Janhunen et al. 2010, Rev. Sci. Instrum. 81 (from memory): about 454 nN/m at 20 kV, n 7.3 cm^-3, 400 km/s.
    ['electric-sail', ['tether_voltage=20 kV', 'solar_wind_density=7.3'], 'thrust_per_length', 454, 0],
    // Lubin 2016, JBIS 69 (from memory): 0.167 c at the diffraction distance for the worked case.
    ['beam-sail', ['beam_power=100 GW', 'craft_mass=1 g'], 'speed_at_diffraction_distance', 0.167, 3],
    // MacNeal 1967, NASA CR-84460 (from memory): root tension 1.00 N for the worked heliogyro.
    ['bladed-sail', ['spin_rate=1 rpm', 'tip_mass=0.1 kg'], 'root_tension', 1.0, 2],
    // Derived first-order billow: 1.38 rpm keeps a 14 m disc within 1 % of its radius on an ideal sail.
    ['spin-disc', ['sail_efficiency=1', 'allowed_billow=0.14 m'], 'min_spin_rate', 1.38, 2],
  ] as const)('gives the worked value of %s with --input', (id, inputs, key, expected, digits) => {
    const { status, output } = evaluate('--template', id, ...inputs.flatMap((input) => ['--input', input]));
    expect(output.errors).toEqual([]);
    expect(status).toBe(0);
    expect(output.values[key]?.value).toBeCloseTo(expected, digits);
  });

  it('refuses an unknown template with exit code 2', () => {
    const { status, output } = evaluate('--template', 'kite-sail');
    expect(status).toBe(2);
    expect(output.errors[0]?.message).toMatch(/kite-sail/);
  });
});
