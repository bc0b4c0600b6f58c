import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/square-sail.json';
import { standardHeadline, type TemplateDefinition } from '@/shared/templates/roles';

/** The square sail: membrane on four diagonal booms, three-axis stabilised, with its attitude-control block. */
export const squareSail: TemplateDefinition = {
  id: 'square-sail',
  name: 'Square sail',
  description: 'A square membrane held by four diagonal booms from a central hub: the classic three-axis stabilised sail.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    rows: {
      mass_allocation: 'mass_allocation',
      total_mass: 'total_mass',
      predicted_mass: 'predicted_mass',
      system_margin: 'system_margin',
      sail_area: 'sail_area',
      sail_side: 'sail_side',
      film_thickness: 'film_thickness',
      film_density: 'film_density',
      film_temperature_limit: 'film_temperature_limit',
      areal_density: 'areal_density',
      characteristic_acceleration: 'characteristic_acceleration',
      lightness_number: 'lightness_number',
      srp_force: 'srp_force',
      srp_force_normal: 'srp_force_normal',
      srp_force_transverse: 'srp_force_transverse',
      srp_force_optical: 'srp_force_optical',
      srp_force_circumferential: 'srp_force_circumferential',
      sail_temperature: 'sail_temperature',
      distance: 'distance',
      cone_angle: 'cone_angle',
      reflectivity: 'reflectivity',
      specular_fraction: 'specular_fraction',
      emissivity_front: 'emissivity_front',
      emissivity_back: 'emissivity_back',
      nonlambertian_front: 'nonlambertian_front',
      nonlambertian_back: 'nonlambertian_back',
      sail_efficiency: 'sail_efficiency',
      membrane_mass: 'membrane_mass',
      cp_offset: 'cp_offset',
      disturbance_torque: 'disturbance_torque',
      vane_torque_max: 'vane_torque_max',
      vanes_can_trim: 'vanes_can_trim',
      trim_travel: 'trim_travel',
      inertia_pitch: 'inertia_pitch',
      slew_time: 'slew_time',
    },
    headline: standardHeadline,
    sizingInputs: [
      { role: 'sail_side', min: 5, max: 200 },
      { role: 'film_thickness', min: 1, max: 12.5 },
    ],
    plots: [
      { kind: 'cone-angle' },
      { kind: 'film-thickness' },
      { kind: 'temperature' },
      {
        kind: 'sweep',
        title: 'Disturbance and vane torque versus offset',
        summary: 'The torque a centre-of-pressure offset makes, beside the most one vane can give back.',
        input: 'cp_offset',
        outputs: ['disturbance_torque', 'vane_torque_max'],
        from: '0 m',
        to: '0.2 m',
      },
    ],
    caveats: ['Sail temperature assumes an opaque film.'],
    checks: [
      {
        role: 'vanes_can_trim',
        holds: 'The vanes at full deflection can trim the centre-of-pressure offset.',
        fails:
          'The vanes cannot trim the centre-of-pressure offset: even every vane at full deflection gives less torque than the offset makes. Add a trim mass, larger vanes or longer arms.',
      },
    ],
  },
};
