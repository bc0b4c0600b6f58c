import { evaluateSheet } from '@/shared/engine/evaluate';
import { parseUnit, sameDimension } from '@/shared/engine/units';
import { instantiateTemplate, rowRoleDefinitions, sheetRoles, templates, type RowRole } from '@/shared/templates';

function dimensionOf(unit: string) {
  const parsed = parseUnit(unit);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value.dimension;
}

describe.each(templates.map((template) => [template.id, template] as const))('template %s against its contract', (_id, template) => {
  const sheet = instantiateTemplate(template);
  const rowOf = (role: RowRole) => sheet.parameters.find((parameter) => parameter.key === template.roles.rows[role]);

  it('evaluates with no errors', () => {
    expect(evaluateSheet(sheet).errors).toEqual([]);
  });

  it('has a row for each role of the contract, of the dimension the role needs', () => {
    for (const [role, key] of Object.entries(template.roles.rows) as [RowRole, string][]) {
      const row = rowOf(role);
      expect({ role, key, found: row?.key }).toEqual({ role, key, found: key });
      expect({ role, same: sameDimension(dimensionOf(row?.unit ?? ''), dimensionOf(rowRoleDefinitions[role].dimensionOf)) }).toEqual({
        role,
        same: true,
      });
    }
  });

  it('stamps each role on its row, so sheetRoles finds them all', () => {
    expect(sheetRoles(sheet)).toEqual(template.roles.rows);
  });

  it('has a row for every headline role', () => {
    expect(template.roles.headline.length).toBeGreaterThan(0);
    for (const role of template.roles.headline) expect({ role, present: rowOf(role) !== undefined }).toEqual({ role, present: true });
  });

  it('sizes input rows only, over a range that holds the row value, in the row unit', () => {
    for (const input of template.roles.sizingInputs) {
      const row = rowOf(input.role);
      expect({ role: input.role, input: row?.value !== undefined && row.formula === undefined && row.protected !== true }).toEqual({
        role: input.role,
        input: true,
      });
      expect(input.min).toBeLessThan(input.max);
      expect(row?.value).toBeGreaterThanOrEqual(input.min);
      expect(row?.value).toBeLessThanOrEqual(input.max);
    }
  });
});
