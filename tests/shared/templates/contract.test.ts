import { headlineFigures, roleSweep, templateChecks } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { parseUnit, sameDimension } from '@/shared/engine/units';
import { instantiateTemplate, rowRoleDefinitions, sheetRoles, sheetTemplate, templates, type RowRole } from '@/shared/templates';

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

  it('is the template its own sheet is read as following, also with a row renamed', () => {
    expect(sheetTemplate(sheet).id).toBe(template.id);
    const [firstRole] = template.roles.headline;
    const key = firstRole === undefined ? undefined : template.roles.rows[firstRole];
    const renamed = { ...sheet, parameters: sheet.parameters.map((row) => (row.key === key ? { ...row, key: 'renamed_row' } : row)) };
    expect(sheetTemplate(renamed).id).toBe(template.id);
  });

  it('gives its own headline figures by default, each with a value', () => {
    const figures = headlineFigures(sheet, evaluateSheet(sheet));
    expect(figures.map((figure) => figure.role)).toEqual(template.roles.headline);
    for (const figure of figures)
      expect({ role: figure.role, problem: figure.problem, finite: Number.isFinite(figure.value) }).toEqual({
        role: figure.role,
        problem: undefined,
        finite: true,
      });
  });

  it('offers at least one plot, each sweep over its roles with one dimension and finite values', () => {
    expect(template.roles.plots.length).toBeGreaterThan(0);
    for (const plot of template.roles.plots) {
      if (plot.kind !== 'sweep') continue;
      const dimensions = plot.outputs.map((role) => dimensionOf(rowRoleDefinitions[role].dimensionOf));
      for (const dimension of dimensions) expect(sameDimension(dimension, dimensions[0] ?? dimension)).toBe(true);
      const swept = roleSweep(sheet, { input: plot.input, outputs: plot.outputs, from: plot.from, to: plot.to, steps: 12 });
      expect(swept.ok ? { invalidPoints: swept.result.invalidPoints } : swept.errors).toEqual({ invalidPoints: 0 });
    }
  });

  it('has caveats in words, and checks whose rows answer 1 or 0', () => {
    for (const caveat of template.roles.caveats) expect(caveat).toMatch(/\S.*\.$/);
    const checks = templateChecks(sheet, evaluateSheet(sheet));
    expect(checks.map((check) => check.role)).toEqual(template.roles.checks.map((check) => check.role));
    for (const check of checks) expect({ role: check.role, known: check.status !== 'unknown' }).toEqual({ role: check.role, known: true });
    for (const check of template.roles.checks) {
      if (check.beside !== undefined) expect(template.roles.headline).toContain(check.beside);
    }
  });
});

describe('templateChecks', () => {
  const magnetic = templates.find((template) => template.id === 'magnetic-sail');
  if (magnetic === undefined) throw new Error('no magnetic-sail template');
  const sheet = instantiateTemplate(magnetic);

  it('reads a row that is neither 1 nor 0, or has an error, as unknown with the reason', () => {
    const withValue = {
      ...sheet,
      parameters: sheet.parameters.map((row) => (row.key === 'far_field_holds' ? { ...row, formula: '=0.5' } : row)),
    };
    const [farField] = templateChecks(withValue, evaluateSheet(withValue));
    expect(farField).toMatchObject({ status: 'unknown', message: expect.stringContaining('neither 1 (holds) nor 0 (fails)') });
    const broken = { ...sheet, parameters: sheet.parameters.map((row) => (row.key === 'loop_radius' ? { ...row, unit: 'kg' } : row)) };
    expect(templateChecks(broken, evaluateSheet(broken)).map((check) => check.status)).toEqual(['unknown', 'unknown']);
  });

  it('names a missing role', () => {
    const without = { ...sheet, parameters: sheet.parameters.filter((row) => row.key !== 'fluid_regime_holds') };
    expect(templateChecks(without, evaluateSheet(without))[1]).toMatchObject({
      status: 'unknown',
      message: 'no row of the sheet has the role "fluid_regime_holds"',
    });
  });
});

describe('sheetTemplate', () => {
  it('reads a partial sheet as the template with the most of its roles, not the one with the largest share', () => {
    const square = templates.find((template) => template.id === 'square-sail');
    if (square === undefined) throw new Error('no square-sail template');
    const rows = instantiateTemplate(square).parameters.filter((row) => ['sail_side', 'sail_area', 'areal_density'].includes(row.key));
    // sail_area alone is a ninth of the drag sail's roles but a smaller share of the square sail's.
    expect(sheetTemplate({ name: 'Partial', parameters: rows }).id).toBe('square-sail');
  });

  it('reads a sheet with no roles as the first template of the registry', () => {
    expect(sheetTemplate({ name: 'Blank', parameters: [] }).id).toBe(templates[0]?.id);
  });
});
