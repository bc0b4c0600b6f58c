import { uncertaintyRequestSchema, uncertaintyResultSchema } from '@/shared/schemas/uncertainty';
import { runStudy } from '@/shared/uncertainty';
import { readDraft } from '../helpers/sheet';
import { post, setUpTern } from '../revisions/tern';

jest.setTimeout(60_000);

const tern = setUpTern(['tomas', 'kenji', 'lucia', 'oren', 'priya']);
const { people } = tern;

const study = {
  inputs: [
    { key: 'sail_side', distribution: { kind: 'normal', mean: 40, sd: 1.5 } },
    { key: 'film_thickness', distribution: { kind: 'triangular', min: 2, mode: 2.5, max: 3.5 } },
  ],
  samples: 20_000,
  seed: 4,
  percentiles: [10, 90],
  requirements: [{ output: 'characteristic_acceleration', atLeast: '0.3 mm/s^2' }],
};

async function uncertaintyPath(): Promise<string> {
  const draft = await readDraft(people.tomas, tern.craftId);
  return `${draft.path}/uncertainty`;
}

describe('POST /api/crafts/:craftId/revisions/:revisionId/uncertainty', () => {
  it('runs the study on the server with the shared code: the same figures the browser computes from the same sheet', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const response = await post(people.tomas, `${draft.path}/uncertainty`, study).expect(200);
    const result = uncertaintyResultSchema.parse(response.body);
    const local = runStudy(draft.sheet, uncertaintyRequestSchema.parse(study));
    if (!local.ok) throw new Error('the study does not run locally');
    expect(result).toEqual(local.result);
    expect(result.samples).toBe(20_000);
    expect(result.outputs.map((output) => output.role)).toEqual(expect.arrayContaining(['characteristic_acceleration', 'system_margin']));
    const acceleration = result.outputs.find((output) => output.role === 'characteristic_acceleration');
    expect(acceleration?.percentiles.map((entry) => entry.percentile)).toEqual([5, 10, 50, 90, 95]);
    expect(result.requirements.map((requirement) => requirement.id)).toEqual(
      expect.arrayContaining(['temperature', 'margin', 'request-0']),
    );
    expect(result.caution).toMatch(/Preliminary sizing estimates/);
  });

  it('gives the same answer for the same seed to a viewer, and another for another seed', async () => {
    const path = await uncertaintyPath();
    const first = await post(people.oren, path, study).expect(200);
    const again = await post(people.oren, path, study).expect(200);
    const other = await post(people.oren, path, { ...study, seed: 5 }).expect(200);
    expect(again.body).toEqual(first.body);
    expect(other.body.outputs[0].mean).not.toBe(first.body.outputs[0].mean);
  });

  it('lets a partner vary and read only the rows shared with them, and the headline figures', async () => {
    const path = await uncertaintyPath();
    const visible = new Set((await readDraft(people.lucia, tern.craftId)).sheet.parameters.map((row) => row.key));
    expect(visible.has('sail_side')).toBe(true);
    expect(visible.has('bus_mass')).toBe(false);
    const shared = await post(people.lucia, path, { inputs: [study.inputs[0]], samples: 500 }).expect(200);
    expect(shared.body.outputs.map((output: { role: string }) => output.role)).toContain('characteristic_acceleration');
    const hidden = await post(people.lucia, path, {
      inputs: [{ key: 'bus_mass', distribution: { kind: 'uniform', min: 9, max: 11 } }],
      outputs: ['bus_mass'],
    }).expect(400);
    expect(hidden.body.error.details).toEqual([
      { path: 'body.inputs.0.key', message: 'no row has the key "bus_mass"' },
      { path: 'body.outputs.0', message: 'no row of the sheet plays the role or has the key "bus_mass"' },
    ]);
  });

  it('answers hostile bodies with a 400 naming what and where', async () => {
    const path = await uncertaintyPath();
    const cases: [unknown, string][] = [
      [{ ...study, samples: 1e9 }, 'body.samples'],
      [{ ...study, samples: 2.5 }, 'body.samples'],
      [{ inputs: [] }, 'body.inputs'],
      [{ inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 50, max: 40 } }] }, 'body.inputs.0.distribution.max'],
      [{ inputs: [{ key: 'sail_side', distribution: { kind: 'normal', mean: 40, sd: -1 } }] }, 'body.inputs.0.distribution.sd'],
      [{ inputs: [{ key: 'sail_side', distribution: { kind: 'cauchy' } }] }, 'body.inputs.0.distribution.kind'],
      [{ inputs: [{ key: 'Robert"); DROP TABLE', distribution: { kind: 'uniform', min: 0, max: 1 } }] }, 'body.inputs.0.key'],
      [{ inputs: [{ key: 'sail_area', distribution: { kind: 'uniform', min: 0, max: 1 } }] }, 'body.inputs.0.key'],
      [
        { inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 0, max: 1, unit: 'kg' } }] },
        'body.inputs.0.distribution.unit',
      ],
      [{ ...study, requirements: [{ output: 'characteristic_acceleration', atLeast: '1 parsec' }] }, 'body.requirements.0.atLeast'],
      [{ ...study, percentiles: [100] }, 'body.percentiles.0'],
      [{ ...study, outputs: Array.from({ length: 31 }, () => 'sail_area') }, 'body.outputs'],
      [{ ...study, seed: 'random' }, 'body.seed'],
      [[study], 'body'],
    ];
    for (const [body, where] of cases) {
      const response = await post(people.kenji, path, body as object).expect(400);
      expect(response.body.error.code).toBe('invalid_input');
      expect(response.body.error.details.map((detail: { path: string }) => detail.path)).toContain(where);
      expect(response.body.error.message).toContain(where);
    }
  });

  it('is 404 for a craft of another organisation and for a revision that does not exist', async () => {
    const path = await uncertaintyPath();
    await post(people.priya, path, study).expect(404);
    await post(people.tomas, `/api/crafts/${tern.craftId}/revisions/00000000-0000-4000-8000-000000000000/uncertainty`, study).expect(404);
  });
});
