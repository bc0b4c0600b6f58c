import type { Sheet } from '@/shared/schemas/sheet';

/**
 * The parts a row can play in a template's contract, each with the label screens show for it and a
 * unit of the dimension its row must have. Screens, analyses and the budget find rows by role, never
 * by literal key, so a template of another sail configuration (or a renamed row) still works.
 */
export const rowRoleDefinitions = {
  mass_allocation: { label: 'Mass allocation', dimensionOf: 'kg' },
  total_mass: { label: 'Total mass (CBE)', dimensionOf: 'kg' },
  predicted_mass: { label: 'Predicted mass', dimensionOf: 'kg' },
  system_margin: { label: 'System margin', dimensionOf: 'kg' },
  sail_area: { label: 'Sail area', dimensionOf: 'm^2' },
  sail_side: { label: 'Sail side', dimensionOf: 'm' },
  film_thickness: { label: 'Film thickness', dimensionOf: 'm' },
  film_density: { label: 'Film density', dimensionOf: 'kg/m^3' },
  film_temperature_limit: { label: 'Film temperature limit', dimensionOf: 'K' },
  areal_density: { label: 'Areal density', dimensionOf: 'kg/m^2' },
  characteristic_acceleration: { label: 'Characteristic acceleration', dimensionOf: 'm/s^2' },
  lightness_number: { label: 'Lightness number', dimensionOf: '' },
  srp_force: { label: 'SRP force (ideal sail)', dimensionOf: 'N' },
  srp_force_normal: { label: 'Normal (optical)', dimensionOf: 'N' },
  srp_force_transverse: { label: 'In-plane (optical)', dimensionOf: 'N' },
  srp_force_optical: { label: 'Total (optical)', dimensionOf: 'N' },
  srp_force_circumferential: { label: 'Across sun line (optical)', dimensionOf: 'N' },
  sail_temperature: { label: 'Sail temperature', dimensionOf: 'K' },
  distance: { label: 'Distance from the Sun', dimensionOf: 'm' },
  cone_angle: { label: 'Cone angle', dimensionOf: 'rad' },
  reflectivity: { label: 'Reflectivity', dimensionOf: '' },
  specular_fraction: { label: 'Specular fraction', dimensionOf: '' },
  emissivity_front: { label: 'Front emissivity', dimensionOf: '' },
  emissivity_back: { label: 'Back emissivity', dimensionOf: '' },
  nonlambertian_front: { label: 'Front non-Lambertian coefficient', dimensionOf: '' },
  nonlambertian_back: { label: 'Back non-Lambertian coefficient', dimensionOf: '' },
  sail_efficiency: { label: 'Sail efficiency', dimensionOf: '' },
} as const satisfies Record<string, { label: string; dimensionOf: string }>;

export type RowRole = keyof typeof rowRoleDefinitions;

/** Every role, in the order of `rowRoleDefinitions` (a non-empty tuple, so `z.enum(rowRoles)` accepts it). */
export const rowRoles = Object.keys(rowRoleDefinitions) as [RowRole, ...RowRole[]];

/** Whether a text (a row's `role` field) names a known role. */
export function isRowRole(text: string): text is RowRole {
  return Object.prototype.hasOwnProperty.call(rowRoleDefinitions, text);
}

/** The figures a sizing review reads first, in order: the headline of the sail templates. */
export const standardHeadline: readonly RowRole[] = [
  'areal_density',
  'characteristic_acceleration',
  'lightness_number',
  'srp_force',
  'sail_temperature',
  'predicted_mass',
  'system_margin',
];

/** The figures a sizing run solves for or charts first, in order: the first the sheet has is the default. */
export const sizingTargetRoles: readonly RowRole[] = [
  'characteristic_acceleration',
  'areal_density',
  'lightness_number',
  'system_margin',
  'sail_temperature',
];

/** An input a person may size (sweep, solve for) and the range offered by default, in the row's own unit. */
export interface SizingInput {
  readonly role: RowRole;
  readonly min: number;
  readonly max: number;
}

/** What a template promises: the row of each role, the headline figures in order, and the inputs to size. */
export interface TemplateContract {
  readonly rows: Partial<Record<RowRole, string>>;
  readonly headline: readonly RowRole[];
  readonly sizingInputs: readonly SizingInput[];
}

/** The key of each role present on the sheet's rows (the first row of a role wins). */
export function sheetRoles(sheet: Sheet): Partial<Record<RowRole, string>> {
  const found: Partial<Record<RowRole, string>> = {};
  for (const parameter of sheet.parameters) {
    const role = parameter.role;
    if (role !== undefined && isRowRole(role) && found[role] === undefined) found[role] = parameter.key;
  }
  return found;
}
