import { sheetSchema, type Sheet } from '@/shared/schemas/sheet';
import squareSail from '@/shared/templates/square-sail.json';
import { standardHeadline, type RowRole, type SizingInput, type TemplateContract } from '@/shared/templates/roles';

export * from '@/shared/templates/roles';

/** A sheet a craft can start from, with the contract that tells screens and analyses which row is which. */
export interface TemplateDefinition {
  readonly id: string;
  readonly name: string;
  readonly description: string;
  /** The starting sheet, validated. Rows carry no `role` here: the contract names them. */
  readonly sheet: Sheet;
  readonly roles: TemplateContract;
}

const squareSailContract: TemplateContract = {
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
  },
  headline: standardHeadline,
  sizingInputs: [
    { role: 'sail_side', min: 5, max: 200 },
    { role: 'film_thickness', min: 1, max: 12.5 },
  ],
};

/** Every template a craft can start from, in the order the chooser offers them. */
export const templates: readonly TemplateDefinition[] = [
  {
    id: 'square-sail',
    name: 'Square sail',
    description: 'A square membrane held by four diagonal booms from a central hub: the classic three-axis stabilised sail.',
    sheet: sheetSchema.parse(squareSail),
    roles: squareSailContract,
  },
];

/** The template with this id, or undefined. */
export function findTemplate(id: string): TemplateDefinition | undefined {
  return templates.find((template) => template.id === id);
}

/**
 * The sizing range the templates declare for a role (the first template that sizes it), with the unit
 * of that template's row, so a sheet whose row is in another unit can convert it; undefined when no
 * template sizes the role.
 */
export function sizingRange(role: RowRole): (SizingInput & { readonly unit: string }) | undefined {
  for (const template of templates) {
    const found = template.roles.sizingInputs.find((input) => input.role === role);
    const key = template.roles.rows[role];
    const unit = template.sheet.parameters.find((parameter) => parameter.key === key)?.unit;
    if (found !== undefined && unit !== undefined) return { ...found, unit };
  }
  return undefined;
}

/** A template's sheet with each row's role written on it, ready to become a craft's first draft. */
export function instantiateTemplate(template: TemplateDefinition): Sheet {
  const roleByKey = new Map<string, RowRole>();
  for (const [role, key] of Object.entries(template.roles.rows) as [RowRole, string][]) roleByKey.set(key, role);
  return {
    ...template.sheet,
    parameters: template.sheet.parameters.map((parameter) => {
      const role = roleByKey.get(parameter.key);
      return role === undefined ? parameter : { ...parameter, role };
    }),
  };
}

/** The standard square-sail sheet, validated, with its rows' roles. */
export function squareSailTemplate(): Sheet {
  const template = findTemplate('square-sail');
  if (template === undefined) throw new Error('the square-sail template is missing from the registry');
  return instantiateTemplate(template);
}
