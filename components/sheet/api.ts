import { apiRequest, apiUrl } from '@/components/api/client';
import { rowHistorySchema, type RowHistory } from '@/shared/schemas/history';
import {
  revisionDetailSchema,
  revisionParameterSchema,
  subsystemSchema,
  type CreateParameterBody,
  type RevisionDetail,
  type RevisionParameter,
  type Subsystem,
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

/** GET .../history?key=: one row's changes in the revision, its earlier keys included, newest first (at most 200). */
export function getRowHistory(craftId: string, revisionId: string, key: string): Promise<RowHistory> {
  return apiRequest(
    'GET',
    `/api/crafts/${encodeURIComponent(craftId)}/revisions/${encodeURIComponent(revisionId)}/history?key=${encodeURIComponent(key)}`,
    { schema: rowHistorySchema },
  );
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

function subsystemsPath(craftId: string): string {
  return `/api/crafts/${encodeURIComponent(craftId)}/subsystems`;
}

/** POST /api/crafts/:craftId/subsystems: adds a subsystem (systems and chief engineers); 409 duplicate_name. */
export function createSubsystem(craftId: string, name: string): Promise<Subsystem> {
  return apiRequest('POST', subsystemsPath(craftId), { body: { name }, schema: subsystemSchema });
}

/** PATCH /api/crafts/:craftId/subsystems/:subsystemId: renames a subsystem; its rows and owners stay with it. */
export function renameSubsystem(craftId: string, subsystemId: string, name: string): Promise<Subsystem> {
  return apiRequest('PATCH', `${subsystemsPath(craftId)}/${encodeURIComponent(subsystemId)}`, { body: { name }, schema: subsystemSchema });
}

/** DELETE /api/crafts/:craftId/subsystems/:subsystemId: removes an empty subsystem; 409 in_use (details.keys) while rows are in it. */
export async function deleteSubsystem(craftId: string, subsystemId: string): Promise<void> {
  await apiRequest('DELETE', `${subsystemsPath(craftId)}/${encodeURIComponent(subsystemId)}`);
}

/** The address of GET /api/crafts/:craftId/events, the server-sent stream of changes to the craft's sheets. */
export function sheetEventsUrl(craftId: string): string {
  return apiUrl(`/api/crafts/${encodeURIComponent(craftId)}/events`);
}
