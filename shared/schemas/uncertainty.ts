import { z } from 'zod';
import { parameterKeySchema } from './sheet';

/**
 * An uncertainty (Monte Carlo) study of a sheet: distributions on inputs, how many samples and the seed of
 * the random generator, which figures to read and which requirements to judge; and what it gives back.
 * The API's body, the CLI's options and the browser's worker all speak these shapes.
 */

/** The most samples one study draws: the server runs it on a request, so the cap bounds its CPU time (about 1 s). */
export const MAX_SAMPLES = 100_000;
export const DEFAULT_SAMPLES = 10_000;
/** Percentiles every study reports; a request may add its own. */
export const STANDARD_PERCENTILES = [5, 50, 95] as const;
export const DEFAULT_BINS = 30;

const finite = (what: string) => z.number({ message: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);
/** A unit the distribution's numbers are written in, when it is not the row's own. */
const unitField = z.string().trim().max(60, { message: 'must be at most 60 characters' }).optional();

/** Every value in [min, max] equally likely: a plain range. */
export const uniformSchema = z
  .object({ kind: z.literal('uniform'), min: finite('min'), max: finite('max'), unit: unitField })
  .strict()
  .refine((d) => d.max > d.min, { path: ['max'], message: 'max must be greater than min' });

/** Most likely at `mode`, falling linearly to zero at min and max. */
export const triangularSchema = z
  .object({ kind: z.literal('triangular'), min: finite('min'), mode: finite('mode'), max: finite('max'), unit: unitField })
  .strict()
  .refine((d) => d.max > d.min, { path: ['max'], message: 'max must be greater than min' })
  .refine((d) => d.mode >= d.min && d.mode <= d.max, { path: ['mode'], message: 'mode must lie between min and max' });

/** A normal (Gaussian) distribution of mean `mean` and standard deviation `sd`. */
export const normalSchema = z
  .object({
    kind: z.literal('normal'),
    mean: finite('mean'),
    sd: finite('sd').refine((sd) => sd > 0, 'sd must be greater than 0'),
    unit: unitField,
  })
  .strict();

export const distributionSchema = z.discriminatedUnion('kind', [uniformSchema, triangularSchema, normalSchema], {
  message: 'kind must be uniform, triangular or normal',
});
export type Distribution = z.infer<typeof distributionSchema>;
export type DistributionKind = Distribution['kind'];

/** An input row and the distribution its value is drawn from (numbers in the row's unit unless `unit` says otherwise). */
export const uncertainInputSchema = z.object({ key: parameterKeySchema, distribution: distributionSchema }).strict();
export type UncertainInput = z.infer<typeof uncertainInputSchema>;

/**
 * A figure named by the role its row plays (what screens send), or by a row's key (a sheet file without
 * roles): a role the sheet's rows carry wins.
 */
const figureName = z.string().trim().min(1, { message: 'must not be empty' }).max(60, { message: 'must be at most 60 characters' });

/** A requirement on a figure: at least or at most a value (a number in the row's unit, or text with a unit: "0.1 mm/s^2"). */
export const requirementSchema = z
  .object({
    output: figureName,
    atLeast: z.union([finite('atLeast'), z.string().trim().min(1).max(60)]).optional(),
    atMost: z.union([finite('atMost'), z.string().trim().min(1).max(60)]).optional(),
  })
  .strict()
  .refine((r) => (r.atLeast === undefined) !== (r.atMost === undefined), {
    path: ['atLeast'],
    message: 'give exactly one of atLeast or atMost',
  });
export type Requirement = z.infer<typeof requirementSchema>;

/** POST /api/crafts/:craftId/revisions/:revisionId/uncertainty, the CLI's --vary options and the worker's run message. */
export const uncertaintyRequestSchema = z
  .object({
    inputs: z
      .array(uncertainInputSchema)
      .min(1, { message: 'give at least one input a distribution' })
      .max(50, { message: 'at most 50 inputs' })
      .refine((inputs) => new Set(inputs.map((input) => input.key)).size === inputs.length, {
        message: 'each input may be given only one distribution',
      }),
    samples: z
      .number()
      .int({ message: 'samples must be a whole number' })
      .min(100, { message: 'samples must be at least 100' })
      .max(MAX_SAMPLES, { message: `samples must be at most ${MAX_SAMPLES}` })
      .default(DEFAULT_SAMPLES),
    /** The random generator's seed: the same seed, sheet and request give the same samples. */
    seed: z
      .number()
      .int({ message: 'seed must be a whole number' })
      .min(0, { message: 'seed must be at least 0' })
      .max(2 ** 32 - 1, { message: 'seed must be at most 4294967295' })
      .default(1),
    /** Percentiles (0 to 100, exclusive) reported beside 5, 50 and 95. */
    percentiles: z
      .array(
        z.number().gt(0, { message: 'a percentile must be greater than 0' }).lt(100, { message: 'a percentile must be less than 100' }),
      )
      .max(20, { message: 'at most 20 percentiles' })
      .default([]),
    /** Figures to read; by default the sheet's headline figures. */
    outputs: z.array(figureName).min(1).max(30, { message: 'at most 30 outputs' }).optional(),
    /** Requirements besides those the sheet states (required margin, film temperature limit). */
    requirements: z.array(requirementSchema).max(20, { message: 'at most 20 requirements' }).default([]),
    bins: z
      .number()
      .int()
      .min(5, { message: 'bins must be at least 5' })
      .max(100, { message: 'bins must be at most 100' })
      .default(DEFAULT_BINS),
  })
  .strict();
export type UncertaintyRequest = z.infer<typeof uncertaintyRequestSchema>;
/** The request as written (defaults not yet filled). */
export type UncertaintyRequestInput = z.input<typeof uncertaintyRequestSchema>;

/** A histogram: `counts[i]` samples fell in [from + i·width, from + (i+1)·width) (the last bin includes `to`). */
export const histogramSchema = z.object({ from: z.number(), to: z.number(), counts: z.array(z.number().int()) });
export type Histogram = z.infer<typeof histogramSchema>;

export const percentileValueSchema = z.object({ percentile: z.number(), value: z.number() });

/** One figure over the samples, in its row's unit; statistics are over the samples where it has a finite value. */
export const uncertainOutputSchema = z.object({
  output: z.string(),
  role: z.string().nullable(),
  key: z.string(),
  label: z.string(),
  unit: z.string(),
  /** At the sheet's own inputs. */
  nominal: z.number().nullable(),
  mean: z.number().nullable(),
  sd: z.number().nullable(),
  min: z.number().nullable(),
  max: z.number().nullable(),
  percentiles: z.array(percentileValueSchema),
  histogram: histogramSchema,
  /** Samples at which the figure has no finite value. */
  invalid: z.number().int(),
});
export type UncertainOutput = z.infer<typeof uncertainOutputSchema>;

/** The probability that a requirement is met: samples without a finite value count as not meeting it. */
export const requirementResultSchema = z.object({
  id: z.string(),
  /** What it asks, in words: "Characteristic acceleration at least 0.1 mm/s^2". */
  label: z.string(),
  /** Where the requirement comes from: the sheet (its budget or its limit row) or the request. */
  from: z.enum(['sheet', 'request']),
  probability: z.number(),
  met: z.number().int(),
  samples: z.number().int(),
});
export type RequirementResult = z.infer<typeof requirementResultSchema>;

export const uncertaintyResultSchema = z.object({
  samples: z.number().int(),
  seed: z.number().int(),
  inputs: z.array(
    z.object({ key: z.string(), label: z.string(), unit: z.string(), distribution: distributionSchema, role: z.string().nullable() }),
  ),
  outputs: z.array(uncertainOutputSchema),
  requirements: z.array(requirementResultSchema),
  /** Samples at which some figure read has no finite value. */
  invalidSamples: z.number().int(),
  caution: z.string(),
});
export type UncertaintyResult = z.infer<typeof uncertaintyResultSchema>;
