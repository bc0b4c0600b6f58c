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
  // A template of another configuration adds the roles its figures, plots and checks read, under its own heading.
  // Attitude control (square sail)
  cp_offset: { label: 'Centre-of-pressure offset', dimensionOf: 'm' },
  disturbance_torque: { label: 'Disturbance torque', dimensionOf: 'N m' },
  vane_torque_max: { label: 'Vane torque (one vane)', dimensionOf: 'N m' },
  vanes_can_trim: { label: 'Vanes can trim the offset', dimensionOf: '' },
  trim_travel: { label: 'Trim-mass travel', dimensionOf: 'm' },
  inertia_pitch: { label: 'Pitch inertia', dimensionOf: 'kg m^2' },
  slew_time: { label: 'Slew time', dimensionOf: 's' },
  // Spin-stabilised disc
  spin_rate: { label: 'Spin rate', dimensionOf: 'rad/s' },
  membrane_mass: { label: 'Membrane mass', dimensionOf: 'kg' },
  peak_stress: { label: 'Peak film stress', dimensionOf: 'Pa' },
  billow: { label: 'Billow', dimensionOf: 'm' },
  min_spin_rate: { label: 'Minimum spin rate', dimensionOf: 'rad/s' },
  billow_within_allowance: { label: 'Billow within the allowance', dimensionOf: '' },
  precession_rate: { label: 'Precession rate', dimensionOf: 'rad/s' },
  // Bladed rotating sail
  root_tension: { label: 'Blade root tension', dimensionOf: 'N' },
  root_slope: { label: 'Blade root slope', dimensionOf: 'rad' },
  tip_speed: { label: 'Tip speed', dimensionOf: 'm/s' },
  tip_speed_limit: { label: 'Tip-speed limit', dimensionOf: 'm/s' },
  tip_speed_within_limit: { label: 'Tip speed within the film limit', dimensionOf: '' },
  // Beam-driven sail
  beam_power: { label: 'Beam power', dimensionOf: 'W' },
  craft_mass: { label: 'Craft mass', dimensionOf: 'kg' },
  beam_acceleration: { label: 'Beam acceleration', dimensionOf: 'm/s^2' },
  diffraction_distance: { label: 'Diffraction distance', dimensionOf: 'm' },
  speed_at_diffraction_distance: { label: 'Speed at diffraction distance (non-relativistic)', dimensionOf: '' },
  speed_at_diffraction_distance_relativistic: { label: 'Speed at diffraction distance (relativistic)', dimensionOf: '' },
  // Electric solar-wind sail
  tether_voltage: { label: 'Tether voltage', dimensionOf: 'V' },
  thrust_per_length: { label: 'Thrust per tether length', dimensionOf: 'N/m' },
  thrust: { label: 'Thrust', dimensionOf: 'N' },
  // Magnetic sail
  loop_current: { label: 'Loop current', dimensionOf: 'A' },
  magnetic_moment: { label: 'Magnetic moment', dimensionOf: 'A m^2' },
  standoff_distance: { label: 'Stand-off distance', dimensionOf: 'm' },
  standoff_ratio: { label: 'Stand-off over loop radius', dimensionOf: '' },
  gyroradius_ratio: { label: 'Gyroradius over stand-off', dimensionOf: '' },
  loop_mass: { label: 'Loop mass', dimensionOf: 'kg' },
  far_field_holds: { label: 'Dipole far field holds', dimensionOf: '' },
  fluid_regime_holds: { label: 'Fluid regime holds', dimensionOf: '' },
  // Drag (deorbit) sail
  start_altitude: { label: 'Start altitude', dimensionOf: 'm' },
  ballistic_coefficient: { label: 'Ballistic coefficient', dimensionOf: 'kg/m^2' },
  orbital_lifetime: { label: 'Orbital lifetime', dimensionOf: 's' },
  area_for_25_years: { label: 'Sail area for 25 years', dimensionOf: 'm^2' },
  area_for_5_years: { label: 'Sail area for 5 years', dimensionOf: 'm^2' },
  meets_25_year_rule: { label: 'Meets the 25-year rule', dimensionOf: '' },
  meets_5_year_rule: { label: 'Meets the 5-year rule', dimensionOf: '' },
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

/**
 * A chart a template's sheet offers. The square sail's own analyses by name, or a sweep of one input role
 * reading output roles of one unit (any template can declare one with no code of its own).
 */
export type TemplatePlot =
  | { readonly kind: 'cone-angle' | 'film-thickness' | 'temperature' }
  | {
      readonly kind: 'sweep';
      readonly title: string;
      /** One line on what the chart answers. */
      readonly summary: string;
      readonly input: RowRole;
      /** Rows of one dimension, drawn on one axis. */
      readonly outputs: readonly RowRole[];
      /** The swept range as text with a unit ("0.5 rpm"). */
      readonly from: string;
      readonly to: string;
    };

/**
 * An assumption or requirement the sheet itself decides: the row of `role` is 1 when it holds and 0 when it
 * does not (a visible IF formula), and the contract gives the words for each. `beside` names the headline
 * figure the check qualifies, so a screen shows it there.
 */
export interface TemplateCheck {
  readonly role: RowRole;
  readonly holds: string;
  readonly fails: string;
  readonly beside?: RowRole;
}

/**
 * What a template promises: the row of each role, the headline figures in order, the inputs to size, the
 * charts its sheet offers, the caveats shown with every result, and the checks its rows decide.
 */
export interface TemplateContract {
  readonly rows: Partial<Record<RowRole, string>>;
  readonly headline: readonly RowRole[];
  readonly sizingInputs: readonly SizingInput[];
  readonly plots: readonly TemplatePlot[];
  readonly caveats: readonly string[];
  readonly checks: readonly TemplateCheck[];
}

/** A sheet a craft can start from, with the contract that tells screens and analyses which row is which. */
export interface TemplateDefinition {
  readonly id: string;
  readonly name: string;
  /** One line for the craft chooser. */
  readonly description: string;
  /** The starting sheet, validated. Rows carry no `role` here: the contract names them. */
  readonly sheet: Sheet;
  readonly roles: TemplateContract;
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
