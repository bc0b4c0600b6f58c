import path from 'node:path';
import { cliEvaluationSchema, cliSizeSchema, cliSweepSchema, cliUncertaintySchema } from '@/shared/schemas/cli';
import { uncertaintyRequestSchema } from '@/shared/schemas/uncertainty';
import { squareSailTemplate } from '@/shared/templates';
import { runStudy } from '@/shared/uncertainty';
import { repositoryRoot, runEvaluate } from '../helpers/cli';

const templateFile = path.join(repositoryRoot, 'shared', 'templates', 'square-sail.json');
const evaluate = runEvaluate;

jest.setTimeout(60_000);

describe('npm run evaluate: inputs and templates', () => {
  it('takes --input, and --set as its earlier name, with the same result', () => {
    const byInput = evaluate(templateFile, '--input', 'sail_side=50 m', '--input=distance=1.2');
    const bySet = evaluate(templateFile, '--set', 'sail_side=50 m', '--set=distance=1.2');
    expect(byInput.status).toBe(0);
    expect(byInput.output).toEqual(bySet.output);
    expect(cliEvaluationSchema.parse(byInput.output).values.sail_area).toEqual({ value: 2500, unit: 'm^2' });
  });

  it('evaluates a template by id, as the file of its sheet evaluates', () => {
    const byId = evaluate('--template', 'square-sail');
    expect(byId.status).toBe(0);
    expect(cliEvaluationSchema.parse(byId.output).values).toEqual(cliEvaluationSchema.parse(evaluate(templateFile).output).values);
  });

  it('refuses an unknown template, a file and a template together, and two analyses at once (exit 2)', () => {
    for (const args of [
      ['--template', 'kite'],
      [templateFile, '--template', 'square-sail'],
      ['--template', 'square-sail', '--sweep', 'sail_side', '--vary', 'sail_side=uniform:1,2'],
      ['--template', 'square-sail', '--steps', '3'],
    ]) {
      const { status, output } = evaluate(...args);
      expect(status).toBe(2);
      expect(cliEvaluationSchema.parse(output).errors[0]?.code).toBe('usage');
    }
  });
});

describe('npm run evaluate: analyses', () => {
  it('sweeps an input and prints each output at each point', () => {
    const { status, output } = evaluate(
      '--template',
      'square-sail',
      '--sweep',
      'sail_side',
      '--from',
      '10',
      '--to',
      '0.05 km',
      '--steps',
      '5',
      '--output',
      'sail_area',
    );
    expect(status).toBe(0);
    const sweep = cliSweepSchema.parse(output).result;
    expect(sweep?.input.values).toEqual([10, 20, 30, 40, 50]);
    // Area of a square: side².
    expect(sweep?.outputs[0]).toEqual({ key: 'sail_area', unit: 'm^2', values: [100, 400, 900, 1600, 2500] });
  });

  it('sizes an input to a target, and the sheet evaluated at the answer reaches the target', () => {
    const { status, output } = evaluate(
      '--template',
      'square-sail',
      '--size',
      'sail_side',
      '--output',
      'characteristic_acceleration',
      '--target',
      '0.5 mm/s^2',
    );
    expect(status).toBe(0);
    const sized = cliSizeSchema.parse(output).result;
    if (sized?.status !== 'solved') throw new Error('no solution');
    const check = cliEvaluationSchema.parse(evaluate('--template', 'square-sail', '--input', `sail_side=${sized.input.value}`).output);
    expect(check.values.characteristic_acceleration?.value).toBeCloseTo(0.5, 9);
  });

  it('runs the uncertainty study with the shared code, the same result as in the browser and the API', () => {
    const { status, output } = evaluate(
      '--template',
      'square-sail',
      '--vary',
      'sail_side=normal:4000,100 cm',
      '--vary',
      'film_thickness=triangular:2,2.5,3.5',
      '--samples',
      '3000',
      '--seed',
      '8',
      '--percentile',
      '25',
      '--require',
      'characteristic_acceleration>=0.45 mm/s^2',
    );
    expect(status).toBe(0);
    const printed = cliUncertaintySchema.parse(output).result;
    const local = runStudy(
      squareSailTemplate(),
      uncertaintyRequestSchema.parse({
        inputs: [
          { key: 'sail_side', distribution: { kind: 'normal', mean: 4000, sd: 100, unit: 'cm' } },
          { key: 'film_thickness', distribution: { kind: 'triangular', min: 2, mode: 2.5, max: 3.5 } },
        ],
        samples: 3000,
        seed: 8,
        percentiles: [25],
        requirements: [{ output: 'characteristic_acceleration', atLeast: '0.45 mm/s^2' }],
      }),
    );
    expect(local.ok && printed).toEqual(local.ok ? local.result : undefined);
    expect(printed?.requirements.map((requirement) => requirement.label)).toContain('Characteristic acceleration at least 0.45 mm/s²');
  });

  it('names what the study cannot vary (exit 1) and a distribution that describes nothing (exit 2)', () => {
    const formula = evaluate('--template', 'square-sail', '--vary', 'sail_area=uniform:1,2');
    expect(formula.status).toBe(1);
    expect(cliUncertaintySchema.parse(formula.output).errors).toEqual([
      {
        key: 'sail_area',
        code: 'invalid_argument',
        message: '--vary sail_area: sail_area is a formula, not an input: give a distribution to an input it reads',
      },
    ]);
    const empty = evaluate('--template', 'square-sail', '--vary', 'sail_side=normal:40,0');
    expect(empty.status).toBe(2);
    expect(cliEvaluationSchema.parse(empty.output).errors[0]?.message).toBe('--vary sail_side: sd must be greater than 0');
  });
});
