import { z } from 'zod';
import { uncertaintyResultSchema } from './uncertainty';

/**
 * What `npm run --silent evaluate` prints on stdout, one JSON document per run (README.md, "Command line").
 * Exit code 0: no error; 1: the sheet or the analysis has errors (listed); 2: the command line or the file
 * cannot be used.
 */

/** A problem: the row's key ('' when no row is at fault), a code and what is wrong. */
export const cliErrorSchema = z.object({ key: z.string(), code: z.string(), message: z.string() });

/** Evaluating a sheet: every row's value in its own unit, and the errors of the rows without one. */
export const cliEvaluationSchema = z.object({
  values: z.record(z.string(), z.object({ value: z.number(), unit: z.string() })),
  errors: z.array(cliErrorSchema),
});
export type CliEvaluation = z.infer<typeof cliEvaluationSchema>;

/** A row's values along a sweep, in its unit; null where it has no finite value. */
const cliSeriesSchema = z.object({ key: z.string(), unit: z.string(), values: z.array(z.number().nullable()) });

/** --sweep KEY: the input's points and each --output at each point. */
export const cliSweepSchema = z.object({
  analysis: z.literal('sweep'),
  result: z.object({ input: cliSeriesSchema, outputs: z.array(cliSeriesSchema), invalidPoints: z.number().int() }).nullable(),
  errors: z.array(cliErrorSchema),
});

const cliRowValueSchema = z.object({ key: z.string(), value: z.number(), unit: z.string() });

/** --size KEY: the input value at which --output reaches --target, or why no value in the range does. */
export const cliSizeSchema = z.object({
  analysis: z.literal('size'),
  result: z
    .discriminatedUnion('status', [
      z.object({ status: z.literal('solved'), input: cliRowValueSchema, output: cliRowValueSchema }),
      z.object({ status: z.literal('no_solution'), message: z.string() }),
    ])
    .nullable(),
  errors: z.array(cliErrorSchema),
});

/** --vary KEY=...: the uncertainty study, in the API's shape (POST .../uncertainty). */
export const cliUncertaintySchema = z.object({
  analysis: z.literal('uncertainty'),
  result: uncertaintyResultSchema.nullable(),
  errors: z.array(cliErrorSchema),
});

/** Any document the command prints. */
export const cliOutputSchema = z.union([cliEvaluationSchema, cliSweepSchema, cliSizeSchema, cliUncertaintySchema]);
export type CliOutput = z.infer<typeof cliOutputSchema>;
