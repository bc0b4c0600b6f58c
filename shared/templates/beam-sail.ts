import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/beam-sail.json';
import type { TemplateDefinition } from '@/shared/templates/roles';

/** A small sail pushed by a laser array: acceleration, the distance the beam stays focused, and the speed there. */
export const beamSail: TemplateDefinition = {
  id: 'beam-sail',
  name: 'Beam-driven sail',
  description: 'A light sail pushed by a laser array: acceleration, the distance the beam stays on the sail, and the speed reached there.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    rows: {
      beam_power: 'beam_power',
      craft_mass: 'craft_mass',
      beam_acceleration: 'beam_acceleration',
      diffraction_distance: 'diffraction_distance',
      speed_at_diffraction_distance: 'speed_at_diffraction_distance',
      speed_at_diffraction_distance_relativistic: 'speed_at_diffraction_distance_relativistic',
    },
    headline: ['beam_acceleration', 'diffraction_distance', 'speed_at_diffraction_distance', 'speed_at_diffraction_distance_relativistic'],
    sizingInputs: [{ role: 'beam_power', min: 1, max: 1000 }],
    plots: [
      {
        kind: 'sweep',
        title: 'Speed at the diffraction distance versus beam power',
        summary:
          'The speed the sail reaches while the beam still fits on it, at constant acceleration and with the receding sail’s thinner beam.',
        input: 'beam_power',
        outputs: ['speed_at_diffraction_distance', 'speed_at_diffraction_distance_relativistic'],
        from: '1 GW',
        to: '200 GW',
      },
    ],
    caveats: [
      'The whole beam lands on the sail up to the diffraction distance and none after; beam pointing, sail stability and film heating are not modelled.',
      'The sail is flat and faces the beam; the speed is taken at the diffraction distance, not at the end of the beam’s reach.',
    ],
    checks: [],
  },
};
