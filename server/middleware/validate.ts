import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { HttpError } from '../http-error';

type Part = 'params' | 'query' | 'body';
type Schemas = Partial<Record<Part, z.ZodType>>;
type Parsed<S extends Schemas, K extends Part, Fallback> = S[K] extends z.ZodType ? z.output<S[K]> : Fallback;

/** A handler whose params, body and query have the types the schemas produce. */
export type ValidatedHandler<S extends Schemas> = RequestHandler<
  Parsed<S, 'params', Record<string, string>>,
  unknown,
  Parsed<S, 'body', unknown>,
  Parsed<S, 'query', Record<string, unknown>>
>;

/**
 * Validates request parts with shared zod schemas and replaces them with the parsed values, so handlers
 * see typed, trimmed input and nothing parses twice. Fails with 400 invalid_input, field by field.
 */
export function validate<S extends Schemas>(schemas: S): ValidatedHandler<S> {
  return (req, _res, next) => {
    const problems: { path: string; message: string }[] = [];
    const parsed: Partial<Record<Part, unknown>> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) parsed[part] = result.data;
      else for (const issue of result.error.issues) problems.push({ path: [part, ...issue.path].join('.'), message: issue.message });
    }
    if (problems.length > 0) {
      const where = problems.map((problem) => `${problem.path} ${problem.message}`).join('; ');
      throw new HttpError(400, 'invalid_input', `Invalid input: ${where}`, problems);
    }
    if (parsed.params) req.params = parsed.params as typeof req.params;
    if (parsed.body) req.body = parsed.body as typeof req.body;
    // Express 5 makes req.query a getter; redefine it to hold the parsed value.
    if (parsed.query) Object.defineProperty(req, 'query', { value: parsed.query, writable: true, configurable: true });
    next();
  };
}
