import { sheetMassBudget } from '@/shared/analyses';
import { evaluateSheet, solveForTarget } from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';
import { uncertaintyRequestSchema, type UncertaintyRequestInput, type UncertaintyResult } from '@/shared/schemas/uncertainty';
import { squareSailTemplate } from '@/shared/templates';
import { prepareStudy, runStudy } from '@/shared/uncertainty';

const row = (key: string, unit: string, definition: { value: number } | { formula: string }) => ({
  key,
  label: key,
  subsystem: 'Test',
  unit,
  ...definition,
});

/** Outputs linear in a uniform and in a normal input, with no roles: figures are named by key. */
const linear: Sheet = {
  name: 'Linear',
  parameters: [
    row('length', 'm', { value: 1 }),
    row('load', 'N', { value: 10 }),
    row('constant_k', 'm', { value: 4 }),
    row('scaled', 'm', { formula: '=3 * length + constant_k / 2' }),
    row('offset', 'kN', { formula: '=2 * load - load / 10' }),
  ],
};

function request(input: UncertaintyRequestInput) {
  return uncertaintyRequestSchema.parse(input);
}

function study(sheet: Sheet, input: UncertaintyRequestInput): UncertaintyResult {
  const ran = runStudy(sheet, request(input));
  if (!ran.ok) throw new Error(JSON.stringify(ran.problems));
  return ran.result;
}

function percentile(result: UncertaintyResult, output: string, p: number): number {
  const value = result.outputs.find((candidate) => candidate.output === output)?.percentiles.find((entry) => entry.percentile === p)?.value;
  if (value === undefined) throw new Error(`no ${p}th percentile of ${output}`);
  return value;
}

const SAMPLES = 100_000;
// Standard normal quantiles z_p = Φ⁻¹(p) (Abramowitz and Stegun, table 26.1): z_0.05 = −1.644854, z_0.25 = −0.674490.
const z = { 5: -1.6448536269514722, 25: -0.6744897501960817, 50: 0, 75: 0.6744897501960817, 95: 1.6448536269514722 } as const;

describe('an uncertainty study of outputs linear in their inputs', () => {
  // scaled = 3·length + 2 (m): for length ~ U(a, b), Q(p) = 3(a + p(b − a)) + 2, the uniform's quantile function.
  // offset = 2·load − load/10 = 1.9·load (N, read in kN): for load ~ N(μ, σ), Q(p) = 1.9(μ + σ z_p) / 1000.
  const result = study(linear, {
    inputs: [
      { key: 'length', distribution: { kind: 'uniform', min: 2, max: 6 } },
      { key: 'load', distribution: { kind: 'normal', mean: 500, sd: 40 } },
    ],
    outputs: ['scaled', 'offset'],
    samples: SAMPLES,
    seed: 2026,
    percentiles: [25, 75],
  });

  it('gives the closed-form quantiles of a uniform input, within sampling error', () => {
    // Sampling error of a p-quantile: sqrt(p(1 − p)/n) / f(Q), f = 1/(3·4) here; at most 0.019 m (p = 1/2), so 0.08 m is four of them.
    for (const p of [5, 25, 50, 75, 95])
      expect(Math.abs(percentile(result, 'scaled', p) - (3 * (2 + (p / 100) * 4) + 2))).toBeLessThan(0.08);
  });

  it('gives the closed-form quantiles of a normal input, within sampling error', () => {
    // Sampling error: sqrt(p(1 − p)/n) / φ(z_p) · 1.9σ, at most about 0.51 N at p = 5 %; 2 N is four of them.
    for (const p of [5, 25, 50, 75, 95] as const) {
      const expected = (1.9 * (500 + 40 * z[p])) / 1000;
      expect(Math.abs(percentile(result, 'offset', p) - expected)).toBeLessThan(0.002);
    }
    const offset = result.outputs.find((output) => output.output === 'offset');
    expect(offset?.unit).toBe('kN');
    expect(offset?.nominal).toBeCloseTo(0.019, 12);
    expect(offset?.sd).toBeCloseTo((1.9 * 40) / 1000, 3);
  });

  it('gives the probability of a requirement on a linear output: P(3·length + 2 ≥ 14) = 1/2, P(≤ 9.2 m) = 0.1', () => {
    const judged = study(linear, {
      inputs: [{ key: 'length', distribution: { kind: 'uniform', min: 2, max: 6 } }],
      outputs: ['scaled'],
      samples: SAMPLES,
      requirements: [
        { output: 'scaled', atLeast: 14 },
        { output: 'scaled', atMost: '920 cm' },
      ],
    });
    const [atLeast, atMost] = judged.requirements;
    // Three binomial standard errors, sqrt(p(1 − p)/n) ≤ 0.0016.
    expect(Math.abs((atLeast?.probability ?? 0) - 0.5)).toBeLessThan(0.005);
    expect(Math.abs((atMost?.probability ?? 0) - 0.1)).toBeLessThan(0.005);
    expect(atMost?.label).toBe('scaled at most 9.2 m');
    expect(atLeast?.met).toBe(Math.round((atLeast?.probability ?? 0) * SAMPLES));
  });

  it('counts every sample in each histogram', () => {
    for (const output of result.outputs) expect(output.histogram.counts.reduce((sum, count) => sum + count, 0)).toBe(SAMPLES);
  });
});

describe('seeds', () => {
  const input: UncertaintyRequestInput = {
    inputs: [
      { key: 'sail_side', distribution: { kind: 'normal', mean: 40, sd: 2 } },
      { key: 'film_thickness', distribution: { kind: 'triangular', min: 2, mode: 2.5, max: 4 } },
    ],
    samples: 5000,
    seed: 99,
  };
  const sheet = squareSailTemplate();

  it('gives the same result for the same seed, another for another seed', () => {
    const first = study(sheet, input);
    expect(study(sheet, input)).toEqual(first);
    expect(study(sheet, { ...input, seed: 100 }).outputs[0]?.mean).not.toBe(first.outputs[0]?.mean);
  });

  it('gives the same result however the samples are split into steps', () => {
    const prepared = prepareStudy(sheet, request(input));
    if (!prepared.ok) throw new Error('not prepared');
    while (prepared.study.done < prepared.study.total) prepared.study.step(777);
    expect(prepared.study.result()).toEqual(study(sheet, input));
  });
});

describe('the requirements a sheet states', () => {
  const sheet = squareSailTemplate();

  it('judges the film temperature limit on each sample, as the sheet evaluates it', () => {
    // Temperature grows as the sail nears the Sun: the distance at which it reaches the limit, found by the engine.
    const limit = evaluateSheet(sheet).values.film_temperature_limit;
    const threshold = solveForTarget(sheet, {
      input: 'distance',
      from: 0.02,
      to: 1,
      output: 'sail_temperature',
      target: `${limit?.value ?? Number.NaN} ${limit?.unit ?? 'K'}`,
    });
    if (!threshold.ok || threshold.result.status !== 'solved') throw new Error('no distance reaches the limit');
    const reached = threshold.result.input.value;
    const result = study(sheet, {
      inputs: [{ key: 'distance', distribution: { kind: 'uniform', min: 0.02, max: 0.5 } }],
      samples: SAMPLES,
    });
    const temperature = result.requirements.find((requirement) => requirement.id === 'temperature');
    // Uniform distance: the share of [0.02, 0.5] AU beyond the distance at which the limit is reached.
    expect(Math.abs((temperature?.probability ?? 0) - (0.5 - reached) / 0.48)).toBeLessThan(0.005);
    expect(temperature?.from).toBe('sheet');
  });

  it('judges the required system margin with the budget roll-up of the whole sheet', () => {
    // The allocation at which the mass budget stops flagging the margin, found with the full roll-up.
    const meets = (allocation: number) => {
      const ran = runStudy(
        { ...sheet, parameters: sheet.parameters.map((p) => (p.key === 'mass_allocation' ? { ...p, value: allocation } : p)) },
        request({ inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 39.999999, max: 40 } }], samples: 100 }),
      );
      return ran.ok && ran.result.requirements.find((requirement) => requirement.id === 'margin')?.probability === 1;
    };
    const budgetMeets = (allocation: number) => {
      const rolled = sheetMassBudget(sheet, evaluateSheet(sheet, { mass_allocation: allocation }));
      return rolled.ok && !rolled.result.systemMargin.belowRequired;
    };
    let low = 20;
    let high = 60;
    for (let step = 0; step < 40; step += 1) {
      const middle = (low + high) / 2;
      if (budgetMeets(middle)) high = middle;
      else low = middle;
    }
    expect(meets(high + 0.01)).toBe(true);
    expect(meets(low - 0.01)).toBe(false);
    const result = study(sheet, {
      inputs: [{ key: 'mass_allocation', distribution: { kind: 'uniform', min: 25, max: 45 } }],
      samples: SAMPLES,
    });
    const margin = result.requirements.find((requirement) => requirement.id === 'margin');
    expect(margin?.label).toMatch(/^System margin at least the required \d+(\.\d+)? % of the (allocation|predicted mass)$/);
    expect(Math.abs((margin?.probability ?? 0) - (45 - high) / 20)).toBeLessThan(0.005);
  });
});

describe('a request the sheet cannot run', () => {
  const sheet = squareSailTemplate();
  const problems = (input: UncertaintyRequestInput) => {
    const ran = runStudy(sheet, request(input));
    return ran.ok ? [] : ran.problems;
  };

  it('names each input that cannot vary, and where it is in the request', () => {
    expect(
      problems({
        inputs: [
          { key: 'sail_area', distribution: { kind: 'uniform', min: 1, max: 2 } },
          { key: 'speed_of_light', distribution: { kind: 'uniform', min: 1, max: 2 } },
          { key: 'no_such_row', distribution: { kind: 'uniform', min: 1, max: 2 } },
          { key: 'sail_side', distribution: { kind: 'normal', mean: 40, sd: 1, unit: 'kg' } },
          { key: 'film_thickness', distribution: { kind: 'normal', mean: 40, sd: 1, unit: 'furlongs per fortnight' } },
        ],
      }),
    ).toEqual([
      { path: 'inputs.0.key', message: 'sail_area is a formula, not an input: give a distribution to an input it reads' },
      { path: 'inputs.1.key', message: 'speed_of_light is protected (a constant), so it cannot vary' },
      { path: 'inputs.2.key', message: 'no row has the key "no_such_row"' },
      { path: 'inputs.3.distribution.unit', message: expect.stringContaining('sail_side is in "m"') },
      { path: 'inputs.4.distribution.unit', message: expect.stringContaining('unknown unit') },
    ]);
  });

  it('names requirements and outputs the sheet has no row for, and a limit in the wrong unit', () => {
    expect(
      problems({
        inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 30, max: 50 } }],
        outputs: ['characteristic_acceleration', 'warp_factor'],
        requirements: [
          { output: 'orbital_lifetime', atLeast: 1 },
          { output: 'characteristic_acceleration', atLeast: '3 kg' },
        ],
      }),
    ).toEqual([
      { path: 'outputs.1', message: 'no row of the sheet plays the role or has the key "warp_factor"' },
      { path: 'requirements.0.output', message: 'no row of the sheet plays the role or has the key "orbital_lifetime"' },
      { path: 'requirements.1.atLeast', message: expect.stringContaining('Characteristic acceleration:') },
    ]);
  });

  it('lets a distribution be written in another unit of the row’s dimension', () => {
    const inMetres = study(sheet, { inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 30, max: 50 } }], samples: 500 });
    const inKilometres = study(sheet, {
      inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 0.03, max: 0.05, unit: 'km' } }],
      samples: 500,
    });
    expect(inKilometres.outputs[0]?.mean).toBeCloseTo(inMetres.outputs[0]?.mean ?? Number.NaN, 9);
  });

  it('hides rows the person may not see: they cannot vary them or read them, but still read headline figures', () => {
    const sees = (key: string) => key !== 'bus_mass' && key !== 'membrane_mass';
    const ran = runStudy(
      sheet,
      request({
        inputs: [{ key: 'bus_mass', distribution: { kind: 'uniform', min: 9, max: 11 } }],
        outputs: ['membrane_mass', 'predicted_mass'],
      }),
      { sees },
    );
    expect(ran.ok ? [] : ran.problems).toEqual([
      { path: 'inputs.0.key', message: 'no row has the key "bus_mass"' },
      { path: 'outputs.0', message: 'no row of the sheet plays the role or has the key "membrane_mass"' },
    ]);
  });
});

describe('the requirements a partner is told about', () => {
  const sheet = squareSailTemplate();
  const input: UncertaintyRequestInput = {
    inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 30, max: 50 } }],
    samples: 200,
  };
  const ids = (sees?: (key: string) => boolean) => {
    const ran = runStudy(sheet, request(input), sees === undefined ? {} : { sees });
    return ran.ok ? ran.result.requirements.map((requirement) => requirement.id) : [];
  };

  it('leaves out a template check whose row the person may not see, and keeps those on headline figures', () => {
    expect(ids()).toEqual(['vanes_can_trim', 'temperature', 'margin']);
    expect(ids((key) => key !== 'vanes_can_trim' && key !== 'mass_allocation' && key !== 'film_temperature_limit')).toEqual([
      'temperature',
      'margin',
    ]);
  });
});

describe('uncertaintyRequestSchema', () => {
  const paths = (input: unknown) => {
    const parsed = uncertaintyRequestSchema.safeParse(input);
    return parsed.success ? [] : parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
  };

  it('refuses distributions that describe nothing, naming the field', () => {
    expect(
      paths({
        inputs: [
          { key: 'a', distribution: { kind: 'uniform', min: 2, max: 2 } },
          { key: 'b', distribution: { kind: 'triangular', min: 0, mode: 3, max: 2 } },
          { key: 'c', distribution: { kind: 'normal', mean: 1, sd: 0 } },
          { key: 'd', distribution: { kind: 'lognormal', mean: 1, sd: 1 } },
          { key: 'e', distribution: { kind: 'uniform', min: '1', max: 2 } },
        ],
      }),
    ).toEqual([
      'inputs.0.distribution.max: max must be greater than min',
      'inputs.1.distribution.mode: mode must lie between min and max',
      'inputs.2.distribution.sd: sd must be greater than 0',
      'inputs.3.distribution.kind: kind must be uniform, triangular or normal',
      'inputs.4.distribution.min: min must be a number',
    ]);
  });

  it('caps the samples, refuses a second distribution for one input and unknown fields', () => {
    const input = { key: 'a', distribution: { kind: 'uniform', min: 0, max: 1 } };
    expect(paths({ inputs: [input], samples: 100_001 })).toEqual(['samples: samples must be at most 100000']);
    expect(paths({ inputs: [input, input] })).toEqual(['inputs: each input may be given only one distribution']);
    expect(paths({ inputs: [input], seed: -1, extra: true })).toEqual(['seed: seed must be at least 0', ': Unrecognized key: "extra"']);
    expect(paths({ inputs: [input], requirements: [{ output: 'x', atLeast: 1, atMost: 2 }] })).toEqual([
      'requirements.0.atLeast: give exactly one of atLeast or atMost',
    ]);
  });
});
