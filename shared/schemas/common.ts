import { z } from 'zod';

/** Identifiers are UUIDs everywhere. */
export const idSchema = z.uuid({ message: 'must be a UUID' });

/**
 * Characters that reorder the text around them (bidirectional embeddings, overrides and isolates): in a name
 * they can make it read as something else ("exe.txt" shown for "txt.exe").
 */
const bidiControls = /[\u202A-\u202E\u2066-\u2069]/u;
/** Line and paragraph separators, and every control character (NUL, tabs, line breaks, escapes, NEL). */
const lineBreakOrControl = /[\p{Cc}\p{Zl}\p{Zp}]/u;
/** Control characters other than tab and the line breaks a block of text may hold. */
const controlBesidesLineBreaks = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/u;
/**
 * What shows nothing on its own: spaces, format characters (zero-width space and joiners, byte-order mark, soft
 * hyphen), combining marks without a base, and the filler letters fonts draw blank.
 */
const invisibleOnly = /^[\p{Z}\p{Cf}\p{M}\u115F\u1160\u3164\uFFA0\u2800]+$/u;

/**
 * A trimmed, non-empty line of text with a maximum length, as people type names and labels: stored in NFC (the
 * composed form, so "é" typed two ways is one name), one line, with something visible, and in reading order.
 */
export function textLine(max: number) {
  return z
    .string()
    .normalize('NFC')
    .trim()
    .min(1, { message: 'must not be empty' })
    .max(max, { message: `must be at most ${max} characters` })
    .refine((text) => !lineBreakOrControl.test(text), { message: 'must be one line of text, without control characters' })
    .refine((text) => !invisibleOnly.test(text), { message: 'must contain a visible character' })
    .refine((text) => !bidiControls.test(text), { message: 'must not contain text-direction override characters' });
}

/**
 * Free text of several lines (a note, a description): stored in NFC, as answered otherwise; tabs and line breaks
 * are kept, other control characters (NUL, which PostgreSQL cannot store, escapes) and direction overrides refused.
 */
export function textBlock(max: number) {
  return z
    .string()
    .normalize('NFC')
    .max(max, { message: `must be at most ${max} characters` })
    .refine((text) => !controlBesidesLineBreaks.test(text), {
      message: 'must not contain control characters other than tabs and line breaks',
    })
    .refine((text) => !bidiControls.test(text), { message: 'must not contain text-direction override characters' });
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
