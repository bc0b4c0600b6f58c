import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/magnetic-sail.json';
import type { TemplateDefinition } from '@/shared/templates/roles';

/** A current loop whose field deflects the solar wind, with the validity of the fluid estimate beside its thrust. */
export const magneticSail: TemplateDefinition = {
  id: 'magnetic-sail',
  name: 'Magnetic sail',
  description: 'A large current loop whose field holds off the solar wind: stand-off, thrust and whether the fluid estimate holds.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    rows: {
      loop_current: 'loop_current',
      magnetic_moment: 'magnetic_moment',
      standoff_distance: 'standoff_distance',
      thrust: 'thrust',
      standoff_ratio: 'standoff_ratio',
      gyroradius_ratio: 'gyroradius_ratio',
      loop_mass: 'loop_mass',
      far_field_holds: 'far_field_holds',
      fluid_regime_holds: 'fluid_regime_holds',
    },
    headline: ['thrust', 'standoff_distance', 'standoff_ratio', 'gyroradius_ratio', 'magnetic_moment', 'loop_mass'],
    sizingInputs: [{ role: 'loop_current', min: 1, max: 1000 }],
    plots: [
      {
        kind: 'sweep',
        title: 'Thrust versus loop current',
        summary: 'The fluid estimate of the thrust: it grows as the current to the power 2/3.',
        input: 'loop_current',
        outputs: ['thrust'],
        from: '5 kA',
        to: '500 kA',
      },
      {
        kind: 'sweep',
        title: 'Validity of the fluid estimate versus loop current',
        summary: 'The far field needs the stand-off ratio well above 1; the fluid regime needs the gyroradius ratio well below 1.',
        input: 'loop_current',
        outputs: ['standoff_ratio', 'gyroradius_ratio'],
        from: '5 kA',
        to: '500 kA',
      },
    ],
    caveats: [
      'A fluid estimate with field compression: outside the far-field and fluid regimes, simulations give less thrust than it does.',
      'The drag coefficient (about 2 to 3.6) belongs to this compression convention; the thrust scales as r^(−4/3) with distance from the Sun.',
    ],
    checks: [
      {
        role: 'far_field_holds',
        beside: 'thrust',
        holds: 'Far field: the stand-off is well outside the loop.',
        fails: 'Outside the far field: the stand-off is too close to the loop for its dipole field; the thrust is not reliable.',
      },
      {
        role: 'fluid_regime_holds',
        beside: 'thrust',
        holds: 'Fluid regime: protons gyrate well inside the stand-off.',
        fails: 'Outside the fluid regime: protons gyrate too wide beside the stand-off; the thrust is likely lower.',
      },
    ],
  },
};
