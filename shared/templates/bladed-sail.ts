import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/bladed-sail.json';
import type { TemplateDefinition } from '@/shared/templates/roles';

/** Long film blades held taut by rotation: root tension, root slope and the tip speed the film allows. */
export const bladedSail: TemplateDefinition = {
  id: 'bladed-sail',
  name: 'Bladed rotating sail',
  description: 'Long film blades kept taut by rotation: root tension, blade slope under pressure and the tip speed the film allows.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    rows: {
      sail_area: 'sail_area',
      film_thickness: 'film_thickness',
      film_density: 'film_density',
      spin_rate: 'spin_rate',
      root_tension: 'root_tension',
      root_slope: 'root_slope',
      tip_speed: 'tip_speed',
      tip_speed_limit: 'tip_speed_limit',
      tip_speed_within_limit: 'tip_speed_within_limit',
      sail_efficiency: 'sail_efficiency',
      distance: 'distance',
      srp_force: 'srp_force',
    },
    headline: ['sail_area', 'root_tension', 'root_slope', 'tip_speed', 'tip_speed_limit'],
    sizingInputs: [{ role: 'spin_rate', min: 0.1, max: 10 }],
    plots: [
      {
        kind: 'sweep',
        title: 'Tip speed and its limit versus spin rate',
        summary: 'The blades may spin until the tip speed meets the limit the film’s allowable stress sets.',
        input: 'spin_rate',
        outputs: ['tip_speed', 'tip_speed_limit'],
        from: '0.2 rpm',
        to: '10 rpm',
      },
      {
        kind: 'sweep',
        title: 'Root tension versus spin rate',
        summary: 'The centrifugal tension that keeps the blades flat against the radiation pressure.',
        input: 'spin_rate',
        outputs: ['root_tension'],
        from: '0.2 rpm',
        to: '5 rpm',
      },
    ],
    caveats: [
      'Blades are tensioned strings: no bending or torsional stiffness; the root slope is the string’s slope under the whole blade load, not rigid coning.',
      'Blade pitch control, flap and twist dynamics are not sized here (the simple flap frequencies hold only for a uniform string without tip mass).',
    ],
    checks: [
      {
        role: 'tip_speed_within_limit',
        beside: 'tip_speed',
        holds: 'The tip speed is within the film’s limit.',
        fails: 'The tip speed exceeds the film’s limit: the root stress passes the allowable. Spin slower or shorten the blades.',
      },
    ],
  },
};
