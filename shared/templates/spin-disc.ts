import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/spin-disc.json';
import type { TemplateDefinition } from '@/shared/templates/roles';

/** A disc held flat by its spin, with no booms: film stress, billow and the spin that keeps it flat. */
export const spinDisc: TemplateDefinition = {
  id: 'spin-disc',
  name: 'Spin-stabilised disc',
  description: 'A disc of film held flat by spinning, with no booms: hub stress, billow and the least spin that keeps it flat.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    rows: {
      sail_area: 'sail_area',
      film_thickness: 'film_thickness',
      film_density: 'film_density',
      membrane_mass: 'membrane_mass',
      spin_rate: 'spin_rate',
      peak_stress: 'peak_stress',
      billow: 'billow',
      min_spin_rate: 'min_spin_rate',
      billow_within_allowance: 'billow_within_allowance',
      sail_efficiency: 'sail_efficiency',
      distance: 'distance',
      cone_angle: 'cone_angle',
      srp_force: 'srp_force',
      cp_offset: 'cp_offset',
      disturbance_torque: 'disturbance_torque',
      precession_rate: 'precession_rate',
    },
    headline: ['sail_area', 'membrane_mass', 'peak_stress', 'billow', 'min_spin_rate', 'precession_rate'],
    sizingInputs: [{ role: 'spin_rate', min: 0.1, max: 10 }],
    plots: [
      {
        kind: 'sweep',
        title: 'Billow versus spin rate',
        summary: 'How far radiation pressure bows the disc as the spin slows: the billow falls as the square of the spin.',
        input: 'spin_rate',
        outputs: ['billow'],
        from: '0.5 rpm',
        to: '5 rpm',
      },
      {
        kind: 'sweep',
        title: 'Peak film stress versus spin rate',
        summary: 'The hoop stress at the hub edge grows as the square of the spin.',
        input: 'spin_rate',
        outputs: ['peak_stress'],
        from: '0.5 rpm',
        to: '5 rpm',
      },
    ],
    caveats: [
      'Stresses are those of an elastic free-edge disc held at a small hub; wrinkles, seams, creep and the film’s orthotropy are ignored.',
      'Billow is a first-order membrane estimate with the hub reacting the load; spin-up and deployment dynamics are not modelled.',
    ],
    checks: [
      {
        role: 'billow_within_allowance',
        beside: 'billow',
        holds: 'The spin keeps the billow within the allowance.',
        fails: 'The disc billows more than allowed: spin it faster than the minimum spin rate.',
      },
    ],
  },
};
