import type { Sheet } from '@/shared/schemas/sheet';
import { beamSail } from '@/shared/templates/beam-sail';
import { bladedSail } from '@/shared/templates/bladed-sail';
import { dragSail } from '@/shared/templates/drag-sail';
import { electricSail } from '@/shared/templates/electric-sail';
import { magneticSail } from '@/shared/templates/magnetic-sail';
import { sheetRoles, type RowRole, type SizingInput, type TemplateDefinition } from '@/shared/templates/roles';
import { spinDisc } from '@/shared/templates/spin-disc';
import { squareSail } from '@/shared/templates/square-sail';

export * from '@/shared/templates/roles';

/**
 * Every template a craft can start from, in the order the chooser offers them. A template is its sheet (JSON)
 * and a module exporting its definition and contract (see square-sail.ts), listed here.
 */
export const templates: readonly TemplateDefinition[] = [squareSail, spinDisc, bladedSail, dragSail, beamSail, electricSail, magneticSail];

/** The template with this id, or undefined. */
export function findTemplate(id: string): TemplateDefinition | undefined {
  return templates.find((template) => template.id === id);
}

/**
 * The template a sheet follows, read from the roles its rows carry (a copy, a sheet read from a file or one
 * with renamed rows still finds its figures): the template with the most of its contract's roles on the sheet,
 * then the larger share of them; the first of the registry on a tie or when no row carries a role.
 */
export function sheetTemplate(sheet: Sheet): TemplateDefinition {
  const present = sheetRoles(sheet);
  let best = { template: templates[0] ?? squareSail, found: -1, share: -1 };
  for (const template of templates) {
    const roles = Object.keys(template.roles.rows) as RowRole[];
    const found = roles.filter((role) => present[role] !== undefined).length;
    const share = found / Math.max(roles.length, 1);
    if (found > best.found || (found === best.found && share > best.share)) best = { template, found, share };
  }
  return best.template;
}

/**
 * The sizing range declared for a role, with the unit of the declaring template's row (so a sheet whose row is
 * in another unit can convert it): the preferred template's (a sheet's own, `sheetTemplate`) first, else the
 * first template that sizes the role; undefined when none does.
 */
export function sizingRange(role: RowRole, preferred?: TemplateDefinition): (SizingInput & { readonly unit: string }) | undefined {
  for (const template of preferred === undefined ? templates : [preferred, ...templates]) {
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
