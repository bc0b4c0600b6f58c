import { apiRequest, apiUpload, apiUrl } from '@/components/api/client';
import {
  attachmentSchema,
  rowAttachmentsSchema,
  type Attachment,
  type AttachmentKind,
  type RowAttachments,
} from '@/shared/schemas/attachments';

function rowEvidencePath(craftId: string, revisionId: string, key: string): string {
  return `/api/crafts/${encodeURIComponent(craftId)}/revisions/${encodeURIComponent(revisionId)}/parameters/${encodeURIComponent(key)}/attachments`;
}

/** GET .../parameters/:key/attachments: the row's files, newest first, and whether the caller may attach. */
export function getRowEvidence(craftId: string, revisionId: string, key: string): Promise<RowAttachments> {
  return apiRequest('GET', rowEvidencePath(craftId, revisionId, key), { schema: rowAttachmentsSchema });
}

/** POST .../parameters/:key/attachments: uploads a file of this kind to the row, reporting the fraction sent. */
export function attachEvidence(
  craftId: string,
  revisionId: string,
  key: string,
  upload: { file: Blob; name: string; kind: AttachmentKind },
  onProgress: (fraction: number) => void,
): Promise<Attachment> {
  const form = new FormData();
  form.append('kind', upload.kind);
  form.append('file', upload.file, upload.name);
  return apiUpload(rowEvidencePath(craftId, revisionId, key), form, { schema: attachmentSchema, onProgress });
}

/** DELETE .../parameters/:key/attachments/:attachmentId: removes the file from the row (409 evidence_required for a measured row's last weighing report). */
export async function removeEvidence(craftId: string, revisionId: string, key: string, attachmentId: string): Promise<void> {
  await apiRequest('DELETE', `${rowEvidencePath(craftId, revisionId, key)}/${encodeURIComponent(attachmentId)}`);
}

/** Where GET /api/crafts/:craftId/attachments/:attachmentId downloads the file. */
export function evidenceDownloadUrl(craftId: string, attachmentId: string): string {
  return apiUrl(`/api/crafts/${encodeURIComponent(craftId)}/attachments/${encodeURIComponent(attachmentId)}`);
}
