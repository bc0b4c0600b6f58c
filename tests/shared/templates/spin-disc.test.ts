import { describeTemplateRows, evaluateTemplateSI, siOf } from './template-sheet';

const rpm = (2 * Math.PI) / 60;
// The engine's P(1 AU) = S0 / c (S0 = 1361 W/m^2, IAU 2015 Resolution B3).
const pressure1au = 1361 / 299_792_458;

describe('spin-disc template', () => {
  describeTemplateRows(
    'spin-disc',
    {
      sail_radius: 'm',
      hub_radius: 'm',
      film_thickness: 'um',
      film_density: 'kg/m^3',
      poisson_ratio: '',
      spin_rate: 'rpm',
      allowed_billow: 'm',
      sail_efficiency: '',
      distance: 'AU',
      cone_angle: 'deg',
    },
    { sail_area: 'm^2', membrane_mass: 'kg', peak_stress: 'Pa', billow: 'm', min_spin_rate: 'rpm' },
  );

  // The worked case: R 14 m, hub 0.8 m, 7.5 um polyimide at 1420 kg/m^3, nu 0.34, 1 rpm, ideal sail at 1 AU.
  const worked = { sail_radius: 14, hub_radius: 0.8, film_thickness: 7.5, film_density: 1420, poisson_ratio: 0.34, sail_efficiency: 1 };

  // Geometry: an annulus of film from the hub edge to the rim.
  it('gives the sail area and membrane mass of the annulus', () => {
    const values = evaluateTemplateSI('spin-disc', worked);
    const area = Math.PI * (14 ** 2 - 0.8 ** 2);
    expect(siOf(values, 'sail_area')).toBeCloseTo(area, 9);
    expect(siOf(values, 'membrane_mass')).toBeCloseTo(area * 7.5e-6 * 1420, 9);
  });

  // Timoshenko & Goodier 1970, §32 (from memory): hoop stress of a spinning annular disc with free edges,
  // sigma_theta(r) = (3 + nu)/8 rho w^2 [a^2 + b^2 + a^2 b^2 / r^2 - (1 + 3 nu)/(3 + nu) r^2]. At the hole (r = a)
  // it is (3 + nu)/4 rho w^2 b^2 + (1 - nu)/4 rho w^2 a^2: the template keeps the first, small-hole term.
  it('gives the hoop stress at the hub edge, the full annular-disc solution to within its small-hole term', () => {
    const values = evaluateTemplateSI('spin-disc', { ...worked, spin_rate: 1 });
    const [a, b, nu, rho, w] = [0.8, 14, 0.34, 1420, rpm];
    const hoopAt = (r: number) =>
      ((3 + nu) / 8) * rho * w ** 2 * (a ** 2 + b ** 2 + (a ** 2 * b ** 2) / r ** 2 - ((1 + 3 * nu) / (3 + nu)) * r ** 2);
    expect(siOf(values, 'peak_stress') / hoopAt(a)).toBeCloseTo(1, 2);
    // Twice the solid disc's centre stress (3 + nu)/8 rho w^2 b^2.
    expect(siOf(values, 'peak_stress')).toBeCloseTo(2 * ((3 + nu) / 8) * rho * w ** 2 * b ** 2, 6);
  });

  // Derived (first order, hub reaction): delta = k p / (sigma_A w^2), k = 4 ln(R / r_h) / (3 + nu), p = 2 P(r) on
  // an ideal sail facing the Sun; worked value 0.266 m at 1 rpm, and 1.38 rpm keeps the billow to 1 % of R.
  it('gives the billow of the worked case and the spin that keeps it to 1 % of the radius', () => {
    const values = evaluateTemplateSI('spin-disc', { ...worked, spin_rate: 1, allowed_billow: 0.14 });
    expect(siOf(values, 'billow')).toBeCloseTo(0.266, 3);
    expect(siOf(values, 'min_spin_rate') / rpm).toBeCloseTo(1.38, 2);
    expect(siOf(values, 'billow_within_allowance')).toBe(0);
  });

  // By another route: at the minimum spin rate the billow is exactly the allowance, and it falls as 1/w^2.
  it('gives the minimum spin rate at which the billow row meets the allowance', () => {
    const minimum = siOf(evaluateTemplateSI('spin-disc', worked), 'min_spin_rate');
    const atMinimum = evaluateTemplateSI('spin-disc', { ...worked, spin_rate: `${minimum} rad/s` });
    expect(siOf(atMinimum, 'billow')).toBeCloseTo(siOf(atMinimum, 'allowed_billow'), 9);
    const doubled = evaluateTemplateSI('spin-disc', { ...worked, spin_rate: `${2 * minimum} rad/s` });
    expect(siOf(doubled, 'billow') / siOf(atMinimum, 'billow')).toBeCloseTo(0.25, 9);
    expect(siOf(doubled, 'billow_within_allowance')).toBe(1);
  });

  // McInnes 1999 ch. 2: the normal pressure 2 eta P(r) cos^2(alpha) falls as 1/r^2 and as cos^2 of the cone angle.
  it('bows less away from the Sun and when tilted', () => {
    const base = siOf(evaluateTemplateSI('spin-disc', worked), 'billow');
    expect(siOf(evaluateTemplateSI('spin-disc', { ...worked, distance: 2 }), 'billow')).toBeCloseTo(base / 4, 9);
    expect(siOf(evaluateTemplateSI('spin-disc', { ...worked, cone_angle: 60 }), 'billow')).toBeCloseTo(base / 4, 9);
  });

  // Wie 2004 (from memory): precession Omega_p = T / (I_z w); I_z of the annulus integrated numerically here.
  it('gives the precession rate under the disturbance torque', () => {
    const values = evaluateTemplateSI('spin-disc', { ...worked, spin_rate: 1, cp_offset: 0.05 });
    const sigma = 7.5e-6 * 1420;
    const steps = 2000;
    const h = (14 - 0.8) / steps;
    let inertia = 0;
    for (let k = 0; k < steps; k += 1) {
      const r = 0.8 + (k + 0.5) * h;
      inertia += sigma * r ** 2 * 2 * Math.PI * r * h;
    }
    const force = 2 * pressure1au * Math.PI * (14 ** 2 - 0.8 ** 2);
    expect(siOf(values, 'disturbance_torque')).toBeCloseTo(force * 0.05, 12);
    expect(siOf(values, 'precession_rate') / ((force * 0.05) / (inertia * rpm))).toBeCloseTo(1, 5);
  });
});
