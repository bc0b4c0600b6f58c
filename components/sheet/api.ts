import { apiRequest, apiUrl } from '@/components/api/client';
import {
  revisionDetailSchema,
  revisionParameterSchema,
  type CreateParameterBody,
  type RevisionDetail,
  type RevisionParameter,
  type UpdateParameterBody,
} from '@/shared/schemas/revisions';

function parametersPath(craftId: string, revisionId: string): string {
  return `/api/crafts/${encodeURIComponent(craftId)}/revisions/${encodeURIComponent(revisionId)}/parameters`;
}

/** GET /api/crafts/:craftId/revisions/:revisionId: the revision, its rows with versions, subsystems and the caller's abilities. */
export function getRevision(craftId: string, revisionId: string): Promise<RevisionDetail> {
  return apiRequest('GET', `/api/crafts/${encodeURIComponent(craftId)}/revisions/${encodeURIComponent(revisionId)}`, {
    schema: revisionDetailSchema,
  });
}

/** POST .../parameters: adds a row (engineers); the row as stored. */
export function createParameter(craftId: string, revisionId: string, body: CreateParameterBody): Promise<RevisionParameter> {
  return apiRequest('POST', parametersPath(craftId, revisionId), { body, schema: revisionParameterSchema });
}

/** PATCH .../parameters/:key: changes a row read at `body.version` (409 version_conflict when someone changed it since); the row now. */
export function updateParameter(craftId: string, revisionId: string, key: string, body: UpdateParameterBody): Promise<RevisionParameter> {
  return apiRequest('PATCH', `${parametersPath(craftId, revisionId)}/${encodeURIComponent(key)}`, {
    body,
    schema: revisionParameterSchema,
  });
}

/** DELETE .../parameters/:key?version=N: removes a row; 409 in_use while other rows read it. */
export async function deleteParameter(craftId: string, revisionId: string, key: string, version: number): Promise<void> {
  await apiRequest('DELETE', `${parametersPath(craftId, revisionId)}/${encodeURIComponent(key)}?version=${version}`);
}

/** The address of GET /api/crafts/:craftId/events, the server-sent stream of changes to the craft's sheets. */
export function sheetEventsUrl(craftId: string): string {
  return apiUrl(`/api/crafts/${encodeURIComponent(craftId)}/events`);
}
