import { apiRequest, apiUrl } from '@/components/api/client';
import { auditListSchema, type AuditAction, type AuditEvent } from '@/shared/schemas/audit';
import {
  promotionSchema,
  revisionListSchema,
  revisionSchema,
  type LockBaselineBody,
  type OpenStudyBody,
  type PromoteStudyBody,
  type Promotion,
  type Revision,
} from '@/shared/schemas/revisions';

function revisionsPath(craftId: string): string {
  return `/api/crafts/${encodeURIComponent(craftId)}/revisions`;
}

/** GET /api/crafts/:craftId/revisions: the draft, the baselines and the studies, oldest first. */
export async function listRevisions(craftId: string): Promise<Revision[]> {
  const { revisions } = await apiRequest('GET', revisionsPath(craftId), { schema: revisionListSchema });
  return revisions;
}

/** POST .../revisions/:revisionId/lock: locks the working draft as a baseline; the draft continues from it. */
export function lockBaseline(craftId: string, revisionId: string, body: LockBaselineBody): Promise<Revision> {
  return apiRequest('POST', `${revisionsPath(craftId)}/${encodeURIComponent(revisionId)}/lock`, { body, schema: revisionSchema });
}

/** POST .../revisions/:revisionId/studies: opens a study from the revision, owned by the caller. */
export function openStudy(craftId: string, revisionId: string, body: OpenStudyBody): Promise<Revision> {
  return apiRequest('POST', `${revisionsPath(craftId)}/${encodeURIComponent(revisionId)}/studies`, { body, schema: revisionSchema });
}

/** POST .../revisions/:studyId/promote: merges the study into the draft; 409 merge_conflicts until every conflict is resolved. */
export function promoteStudy(craftId: string, studyId: string, body: PromoteStudyBody): Promise<Promotion> {
  return apiRequest('POST', `${revisionsPath(craftId)}/${encodeURIComponent(studyId)}/promote`, { body, schema: promotionSchema });
}

/** The address of a revision's review pack (a PDF the browser downloads). */
export function reviewPackUrl(craftId: string, revisionId: string): string {
  return apiUrl(`${revisionsPath(craftId)}/${encodeURIComponent(revisionId)}/review.pdf`);
}

function auditPath(craftId: string, action: AuditAction | undefined, format?: 'csv'): string {
  const query = new URLSearchParams({ ...(action === undefined ? {} : { action }), ...(format === undefined ? {} : { format }) });
  const search = query.toString();
  return `/api/crafts/${encodeURIComponent(craftId)}/audit${search === '' ? '' : `?${search}`}`;
}

/** GET /api/crafts/:craftId/audit[?action=]: the craft's audit log, newest first (organisation admins, chief engineers). */
export async function listAudit(craftId: string, action: AuditAction | undefined): Promise<AuditEvent[]> {
  const { events } = await apiRequest('GET', auditPath(craftId, action), { schema: auditListSchema });
  return events;
}

/** The address of the audit log as CSV (a file the browser downloads), with the same filter. */
export function auditCsvUrl(craftId: string, action: AuditAction | undefined): string {
  return apiUrl(auditPath(craftId, action, 'csv'));
}
