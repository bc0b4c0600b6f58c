import { z } from 'zod';

/** Identifiers are UUIDs everywhere. */
export const idSchema = z.uuid({ message: 'must be a UUID' });

/** A trimmed, non-empty line of text with a maximum length. */
export function textLine(max: number) {
  return (
    z
      .string()
      .trim()
      .min(1, { message: 'must not be empty' })
      .max(max, { message: `must be at most ${max} characters` })
      // A single line: control characters (NUL, line breaks, tabs, escapes) have no place in a name or label.
      .refine((text) => !/\p{Cc}/u.test(text), { message: 'must be one line of text, without control characters' })
  );
}

/** The one error shape every API failure uses. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.unknown().optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;

/** Field-by-field validation details: a path such as "body.name" and what is wrong there. */
export const fieldErrorSchema = z.object({ path: z.string(), message: z.string() });
export type FieldError = z.infer<typeof fieldErrorSchema>;

/** Zod issues as one line, each with its path: "PORT: expected number; name: must not be empty". */
export function describeIssues(issues: readonly { path: readonly PropertyKey[]; message: string }[]): string {
  return issues
    .map((issue) => (issue.path.length > 0 ? `${issue.path.map(String).join('.')}: ${issue.message}` : issue.message))
    .join('; ');
}
