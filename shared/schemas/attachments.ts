import { z } from 'zod';
import { idSchema } from './common';
import { craftParamsSchema } from './crafts';
import { parameterParamsSchema, personRefSchema } from './revisions';

/**
 * Evidence on a sheet's rows: datasheets, weighing reports, test reports and other files attached to a row
 * of a revision. The file is kept once; copies of the revision (baselines, studies) name the same file.
 */

export const attachmentKinds = ['datasheet', 'weighing_report', 'test_report', 'other'] as const;
export const attachmentKindSchema = z.enum(attachmentKinds);
export type AttachmentKind = z.infer<typeof attachmentKindSchema>;

/** How people name each kind. */
export const attachmentKindLabels: Readonly<Record<AttachmentKind, string>> = {
  datasheet: 'Datasheet',
  weighing_report: 'Weighing report',
  test_report: 'Test report',
  other: 'Other',
};

/** The kind whose presence lets a mass row be marked measured (shared/budget/measured-evidence.ts). */
export const WEIGHING_REPORT: AttachmentKind = 'weighing_report';

/** File types accepted as evidence, sniffed from the content: PDF, PNG and JPEG images, spreadsheets, plain text (CSV included). */
export const evidenceMediaTypes = [
  'application/pdf',
  'image/png',
  'image/jpeg',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  'application/vnd.oasis.opendocument.spreadsheet',
  'text/plain',
] as const;

/** What the file picker offers (the server still decides by content). */
export const evidenceFileExtensions = ['.pdf', '.png', '.jpg', '.jpeg', '.xlsx', '.ods', '.csv', '.txt'] as const;

/** The largest evidence file: 10 MB. */
export const evidenceMaxBytes = 10 * 1024 * 1024;

/** POST .../parameters/:key/attachments: the multipart text field beside the file. */
export const attachBodySchema = z.object({ kind: attachmentKindSchema }).strict();
export type AttachBody = z.infer<typeof attachBodySchema>;

export const rowAttachmentParamsSchema = parameterParamsSchema.extend({ attachmentId: idSchema });
export const attachmentParamsSchema = craftParamsSchema.extend({ attachmentId: idSchema });

/** One attached file as listed: no bytes, which are downloaded from `GET /api/crafts/:craftId/attachments/:id`. */
export const attachmentSchema = z.object({
  id: idSchema,
  name: z.string(),
  /** The type sniffed from the content when it was uploaded. */
  mediaType: z.string(),
  /** Bytes. */
  size: z.number().int().positive(),
  kind: attachmentKindSchema,
  uploadedBy: personRefSchema.nullable(),
  uploadedAt: z.string(),
  /** Whether the caller may remove it from this row. */
  removable: z.boolean(),
});
export type Attachment = z.infer<typeof attachmentSchema>;

/** GET .../parameters/:key/attachments: the row's evidence, newest first, and whether the caller may attach more. */
export const rowAttachmentsSchema = z.object({
  attachments: z.array(attachmentSchema),
  /** Undefined when the caller may attach to the row; else why not (a locked baseline, their role). */
  attachRefusal: z.string().optional(),
});
export type RowAttachments = z.infer<typeof rowAttachmentsSchema>;
