import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { CliEvaluation } from '@/shared/schemas/cli';
import { repositoryRoot, runEvaluate } from '../helpers/cli';

const template = path.join(repositoryRoot, 'shared', 'templates', 'square-sail.json');
const evaluate = (...args: string[]) => runEvaluate<CliEvaluation>(...args);

function sheetFile(content: unknown): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'trimsheet-cli-')), 'sheet.json');
  writeFileSync(file, typeof content === 'string' ? content : JSON.stringify(content));
  return file;
}

jest.setTimeout(60_000);

describe('npm run evaluate', () => {
  it('prints the values of the template as JSON and exits 0', () => {
    const { status, output } = evaluate(template);
    expect(status).toBe(0);
    expect(output.errors).toEqual([]);
    expect(output.values.sail_area).toEqual({ value: 1600, unit: 'm^2' });
    // McInnes 1999 ch. 2: about 263 K at 1 AU with the tabulated coefficients.
    expect(output.values.sail_temperature?.value).toBeCloseTo(263, 0);
  });

  it('applies --set values with and without a unit', () => {
    const { status, output } = evaluate(template, '--set', 'sail_side=800 m', '--set', 'sail_efficiency=1', '--set=distance=1');
    expect(status).toBe(0);
    // Common practice: ideal 800 m square sail at 1 AU, 5.8 N.
    expect(output.values.srp_force?.value).toBeCloseTo(5.8, 1);
    expect(evaluate(template, '--set', 'sail_side=0.8 km').output.values.sail_side).toEqual({ value: 800, unit: 'm' });
  });

  it('exits 1 and names the key of each error, still printing the other values', () => {
    const file = sheetFile({
      name: 'bad',
      parameters: [
        { key: 'side', label: 'side', subsystem: 's', unit: 'm', value: 2 },
        { key: 'area', label: 'area', subsystem: 's', unit: 'kg', formula: '=side^2' },
        { key: 'boom2', label: 'bad key', subsystem: 's', unit: 'm', value: 1 },
        { key: 'twice', label: 'twice', subsystem: 's', unit: 'm', formula: '=2 * side' },
      ],
    });
    const { status, output } = evaluate(file, '--set', 'side=3 kg');
    expect(status).toBe(1);
    expect(output.errors.map((error) => [error.key, error.code])).toEqual([
      ['boom2', 'invalid_parameter'],
      ['side', 'dimension_mismatch'],
      ['area', 'dimension_mismatch'],
    ]);
    expect(output.values.twice).toEqual({ value: 4, unit: 'm' });
  });

  it('exits 2 for a file that is not a sheet or a bad command line', () => {
    expect(evaluate(sheetFile('{ not json')).status).toBe(2);
    const notSheet = evaluate(sheetFile({ parameters: 3 }));
    expect(notSheet.status).toBe(2);
    expect(notSheet.output.errors[0]?.code).toBe('invalid_sheet');
    expect(evaluate(template, '--set', 'no_equals_sign').status).toBe(2);
    expect(evaluate(template, '--bogus').output.errors[0]?.code).toBe('usage');
  });
});
