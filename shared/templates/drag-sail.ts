import { RADIATION_PRESSURE_CAVEAT, SOLAR_CYCLE_CAVEAT } from '@/shared/sail/orbital-decay';
import { sheetSchema } from '@/shared/schemas/sheet';
import sheet from '@/shared/templates/drag-sail.json';
import type { TemplateDefinition } from '@/shared/templates/roles';

/** The drag (deorbit) sail: how long a craft's orbit lasts with its sail out, against the debris rules. */
export const dragSail: TemplateDefinition = {
  id: 'drag-sail',
  name: 'Drag sail',
  description:
    'A sail that brings a satellite down: orbital lifetime through a density model, and the area that meets the 25-year and 5-year rules.',
  sheet: sheetSchema.parse(sheet),
  roles: {
    // Only roles of its own: a sheet is matched to the template with the largest share of its roles present, and
    // the shared ones (sail area, craft mass) would pull other templates' sheets here.
    rows: {
      start_altitude: 'start_altitude',
      ballistic_coefficient: 'ballistic_coefficient',
      orbital_lifetime: 'orbital_lifetime',
      area_for_25_years: 'area_for_25_years',
      area_for_5_years: 'area_for_5_years',
      meets_25_year_rule: 'meets_25_year_rule',
      meets_5_year_rule: 'meets_5_year_rule',
    },
    headline: ['orbital_lifetime', 'area_for_25_years', 'area_for_5_years', 'ballistic_coefficient'],
    // The sail area is not offered here: sizing ranges are looked up by role across templates, and the square
    // sail's area is a formula of its side.
    sizingInputs: [{ role: 'start_altitude', min: 300, max: 1000 }],
    plots: [
      {
        kind: 'sweep',
        title: 'Orbital lifetime versus start altitude',
        summary: 'How long the orbit lasts with the sail out, from each altitude the craft could end its mission at.',
        input: 'start_altitude',
        outputs: ['orbital_lifetime'],
        from: '300 km',
        to: '1000 km',
      },
    ],
    caveats: [SOLAR_CYCLE_CAVEAT, RADIATION_PRESSURE_CAVEAT],
    checks: [
      {
        role: 'meets_25_year_rule',
        holds: 'The orbit decays within 25 years: the IADC guideline (IADC-02-01) is met.',
        fails:
          'The orbit lasts longer than 25 years: the IADC guideline (IADC-02-01) is not met. Enlarge the sail or end the mission lower.',
        beside: 'orbital_lifetime',
      },
      {
        role: 'meets_5_year_rule',
        holds: 'The orbit decays within 5 years: the FCC rule (FCC 22-74) is met.',
        fails: 'The orbit lasts longer than 5 years: the FCC rule (FCC 22-74) is not met. Enlarge the sail or end the mission lower.',
        beside: 'orbital_lifetime',
      },
    ],
  },
};
