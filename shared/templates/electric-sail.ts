import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/electric-sail.json';
import type { TemplateDefinition } from '@/shared/templates/roles';

/** Charged tethers that push against the solar wind's protons. */
export const electricSail: TemplateDefinition = {
  id: 'electric-sail',
  name: 'Electric solar-wind sail',
  description:
    'Long charged tethers that the solar wind’s protons push against: thrust per length, thrust and characteristic acceleration.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    rows: {
      tether_voltage: 'tether_voltage',
      craft_mass: 'craft_mass',
      distance: 'distance',
      thrust_per_length: 'thrust_per_length',
      thrust: 'thrust',
      characteristic_acceleration: 'characteristic_acceleration',
    },
    headline: ['thrust_per_length', 'thrust', 'characteristic_acceleration'],
    sizingInputs: [{ role: 'tether_voltage', min: 1, max: 40 }],
    plots: [
      {
        kind: 'sweep',
        title: 'Thrust versus distance from the Sun',
        summary: 'The thrust falls as 1/r: the sheath around each tether widens as the wind thins.',
        input: 'distance',
        outputs: ['thrust'],
        from: '0.5 AU',
        to: '5 AU',
      },
      {
        kind: 'sweep',
        title: 'Thrust per length versus tether voltage',
        summary: 'Nothing below the voltage that stops a solar-wind proton, then close to linear in the voltage.',
        input: 'tether_voltage',
        outputs: ['thrust_per_length'],
        from: '0 kV',
        to: '40 kV',
      },
    ],
    caveats: [
      'The solar wind’s density and speed are values at 1 AU; they vary several-fold from hour to hour, and the thrust with them.',
      'No power figure: the electron current the tethers collect, and the power that holds their voltage, need a current model not given here.',
    ],
    checks: [],
  },
};
