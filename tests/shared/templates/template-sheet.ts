import { siValues } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { findTemplate, instantiateTemplate, type TemplateDefinition } from '@/shared/templates';

/** Constants as the templates' rows hold them (CODATA 2018; the elementary charge exact in the 2019 SI). */
export const protonMass = 1.67262192369e-27;
export const elementaryCharge = 1.602176634e-19;

/** A template of the registry by id (the test fails when it is missing). */
export function templateById(id: string): TemplateDefinition {
  const template = findTemplate(id);
  if (template === undefined) throw new Error(`no template "${id}" in the registry`);
  return template;
}

/**
 * The template's sheet evaluated with the overrides (text with a unit, or a number in the row's unit), every
 * value in SI; the test fails on any row error. Reading SI keeps each check independent of the row's display unit.
 */
export function evaluateTemplateSI(id: string, overrides: Record<string, number | string> = {}): Record<string, number> {
  const sheet = instantiateTemplate(templateById(id));
  const evaluation = evaluateSheet(sheet, overrides);
  expect(evaluation.errors).toEqual([]);
  return siValues(sheet, evaluation);
}

/** The SI value of one row (the test fails when the row has none). */
export function siOf(values: Record<string, number>, key: string): number {
  const value = values[key];
  if (value === undefined) throw new Error(`no value for ${key}`);
  return value;
}

/**
 * Checks a template's rows against what the issue asks: each listed key with exactly its unit, a note and a
 * source on every row (or on the listed rows of a block added to a template), and a visible formula on every
 * listed output.
 */
export function describeTemplateRows(
  id: string,
  inputs: Record<string, string>,
  outputs: Record<string, string>,
  sourced: 'every row' | 'these rows' = 'every row',
): void {
  const { sheet } = templateById(id);
  it('has each required key with exactly its unit', () => {
    const units = Object.fromEntries(sheet.parameters.map((parameter) => [parameter.key, parameter.unit]));
    for (const [key, unit] of Object.entries({ ...inputs, ...outputs })) expect({ key, unit: units[key] }).toEqual({ key, unit });
  });

  it(`has a note and a source on ${sourced}, inputs as values and outputs as visible formulas`, () => {
    const listed = new Set([...Object.keys(inputs), ...Object.keys(outputs)]);
    const checked = sourced === 'every row' ? sheet.parameters : sheet.parameters.filter((parameter) => listed.has(parameter.key));
    for (const parameter of checked) {
      const [note, source] = [parameter.note ?? '', parameter.source ?? ''].map((text) => text.trim() !== '');
      expect({ key: parameter.key, note, source }).toEqual({
        key: parameter.key,
        note: true,
        source: true,
      });
    }
    const row = (key: string) => sheet.parameters.find((parameter) => parameter.key === key);
    for (const key of Object.keys(inputs)) expect({ key, input: row(key)?.formula === undefined }).toEqual({ key, input: true });
    for (const key of Object.keys(outputs))
      expect({ key, formula: row(key)?.formula }).toEqual({ key, formula: expect.stringMatching(/^=/) });
  });
}
