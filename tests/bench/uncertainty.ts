import { uncertaintyRequestSchema } from '@/shared/schemas/uncertainty';
import { squareSailTemplate } from '@/shared/templates';
import { runStudy, type StudyOptions } from '@/shared/uncertainty';

/** How run.ts reports and times a figure. */
type Report = (name: string, milliseconds: number, target?: number) => void;
type Time = (runs: number, work: () => void) => number;

/**
 * The uncertainty study of the square-sail template: 100,000 samples under 1 s (target), four inputs of the three
 * kinds, the headline figures with their percentiles and histograms, and four requirements (the template's vane
 * check, the sheet's margin and temperature limit, a target characteristic acceleration). Also timed on closures:
 * the browser's path, whose content security policy forbids generated code.
 */
export function benchUncertainty(report: Report, time: Time): void {
  const sheet = squareSailTemplate();
  const request = uncertaintyRequestSchema.parse({
    inputs: [
      { key: 'sail_side', distribution: { kind: 'normal', mean: 40, sd: 1 } },
      { key: 'film_thickness', distribution: { kind: 'triangular', min: 2, mode: 2.5, max: 3.5 } },
      { key: 'boom_linear_density', distribution: { kind: 'uniform', min: 15, max: 25 } },
      { key: 'bus_mass', distribution: { kind: 'normal', mean: 10, sd: 0.5 } },
    ],
    samples: 100_000,
    seed: 1,
    requirements: [{ output: 'characteristic_acceleration', atLeast: '0.4 mm/s^2' }],
  });
  const study = (options: StudyOptions) => () => {
    const ran = runStudy(sheet, request, options);
    if (!ran.ok) throw new Error(`bench setup failed: ${JSON.stringify(ran.problems)}`);
  };
  report('uncertainty study, square-sail template, 100,000 samples (4 inputs, 7 figures, 4 requirements)', time(5, study({})), 1000);
  report(
    'the same study on closures (the browser: its content security policy forbids generated code)',
    time(3, study({ compile: { generatedCode: false } })),
  );
}
