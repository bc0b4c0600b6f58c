import { z } from 'zod';
import { allowanceTableSchema } from './allowance-tables';

/**
 * Why a parameter key is refused, or undefined when it is a usable key.
 * Keys are snake_case and must also be valid spreadsheet names: HyperFormula (and
 * spreadsheet programs we export to) read `boom2`, `r1`, `c2` or `rc` as cell references.
 */
export function parameterKeyProblem(key: string): string | undefined {
  if (!/^[a-z][a-z0-9_]*$/.test(key)) {
    return 'must be snake_case: a lower-case letter, then lower-case letters, digits or underscores';
  }
  if (/^[a-z]+[0-9]+$/.test(key)) return 'looks like a grid address (letters then digits): put an underscore before the digits';
  if (/^r[0-9]*c[0-9]*$/.test(key)) return 'looks like a grid address (r and c with row and column numbers): choose a longer name';
  if (key === 'true' || key === 'false') return 'is a logical constant';
  return undefined;
}

/** A parameter key: snake_case and never read as a grid address. */
export const parameterKeySchema = z.string().superRefine((key, ctx) => {
  const problem = parameterKeyProblem(key);
  if (problem !== undefined) ctx.addIssue({ code: 'custom', message: `key "${key}" ${problem}` });
});

/** One row of a sheet: an input value, a formula, or a value taken from the materials library. */
export const parameterSchema = z
  .object({
    key: parameterKeySchema,
    label: z.string(),
    subsystem: z.string(),
    unit: z.string(),
    value: z.number().optional(),
    formula: z.string().optional(),
    note: z.string().optional(),
    source: z.string().optional(),
    mass: z.object({ maturity: z.string().min(1), category: z.string().min(1) }).optional(),
    protected: z.boolean().optional(),
    material: z.object({ id: z.string().min(1), property: z.string().min(1) }).optional(),
    /** The part the row plays in its template's contract (e.g. "mass_allocation"); screens find rows by it. */
    role: z.string().min(1).max(60).optional(),
  })
  .strict()
  .superRefine((parameter, ctx) => {
    const given = (['value', 'formula', 'material'] as const).filter((field) => parameter[field] !== undefined);
    if (given.length !== 1) {
      ctx.addIssue({
        code: 'custom',
        path: given.length === 0 ? ['value'] : [given[1] ?? 'value'],
        message:
          given.length === 0
            ? `parameter "${parameter.key}": give exactly one of value, formula or material (none given)`
            : `parameter "${parameter.key}": give exactly one of value, formula or material (got ${given.join(' and ')})`,
      });
    }
    if (parameter.value !== undefined && !Number.isFinite(parameter.value)) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: `parameter "${parameter.key}": value must be a finite number` });
    }
    if (parameter.formula !== undefined && !parameter.formula.trimStart().startsWith('=')) {
      ctx.addIssue({ code: 'custom', path: ['formula'], message: `parameter "${parameter.key}": formula must start with "="` });
    }
  });

const sheetHeader = {
  name: z.string().min(1, { message: 'must not be empty' }),
  budget: z
    .object({
      preset: z.string().min(1),
      requiredMarginPercent: z.number().min(0).max(100).optional(),
      /** The craft's own allowance table, used in place of the preset when the craft has one. */
      table: allowanceTableSchema.optional(),
    })
    .strict()
    .optional(),
};

/** A sheet's name and budget settings, without its rows: to read a sheet row by row. */
export const sheetHeaderSchema = z.object(sheetHeader);

/** A craft's sheet: its name, the mass-budget settings and the list of parameters. */
export const sheetSchema = z
  .object({ ...sheetHeader, parameters: z.array(parameterSchema) })
  .strict()
  .superRefine((sheet, ctx) => {
    const seen = new Set<string>();
    sheet.parameters.forEach((parameter, index) => {
      if (seen.has(parameter.key)) {
        ctx.addIssue({ code: 'custom', path: ['parameters', index, 'key'], message: `key "${parameter.key}" is used twice` });
      }
      seen.add(parameter.key);
    });
  });

export type Parameter = z.infer<typeof parameterSchema>;
export type Sheet = z.infer<typeof sheetSchema>;
