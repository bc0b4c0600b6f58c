import { apiRequest, apiUpload, apiUrl } from '@/components/api/client';
import { importPreviewSchema, type AcceptImportBody, type ExportFormat, type ImportPreview } from '@/shared/schemas/exchange';
import { revisionSchema, type Revision } from '@/shared/schemas/revisions';

const craftPath = (craftId: string) => `/api/crafts/${encodeURIComponent(craftId)}`;
const revisionPath = (craftId: string, revisionId: string) => `${craftPath(craftId)}/revisions/${encodeURIComponent(revisionId)}`;

/** Where GET .../export.xlsx | .json | .csv downloads the revision. */
export function exportUrl(craftId: string, revisionId: string, format: ExportFormat): string {
  return apiUrl(`${revisionPath(craftId, revisionId)}/export.${format}`);
}

/** POST .../imports: uploads a workbook against the revision, reporting the fraction sent; resolves with its preview. */
export function importWorkbook(
  craftId: string,
  revisionId: string,
  upload: { file: Blob; name: string },
  onProgress: (fraction: number) => void,
): Promise<ImportPreview> {
  const form = new FormData();
  form.append('file', upload.file, upload.name);
  return apiUpload(`${revisionPath(craftId, revisionId)}/imports`, form, { schema: importPreviewSchema, onProgress });
}

/** POST .../imports/:importId/accept: opens the study; resolves with it. */
export function acceptImport(craftId: string, importId: string, body: AcceptImportBody): Promise<Revision> {
  return apiRequest('POST', `${craftPath(craftId)}/imports/${encodeURIComponent(importId)}/accept`, { body, schema: revisionSchema });
}
