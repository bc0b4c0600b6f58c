import { apiRequest } from '@/components/api/client';
import { memberListSchema, memberSchema, type Member, type SetMemberBody } from '@/shared/schemas/members';
import {
  invitationSchema,
  organisationResponseSchema,
  personSchema,
  type InviteBody,
  type Invitation,
  type OrganisationResponse,
  type Person,
} from '@/shared/schemas/organisation';

const craftPath = (craftId: string) => `/api/crafts/${encodeURIComponent(craftId)}/members`;

/** GET /api/crafts/:craftId/members */
export async function listMembers(craftId: string): Promise<Member[]> {
  const { members } = await apiRequest('GET', craftPath(craftId), { schema: memberListSchema });
  return members;
}

/** PUT /api/crafts/:craftId/members/:userId (org admins): adds a person to a craft or changes their role. */
export function setMember(craftId: string, userId: string, body: SetMemberBody): Promise<Member> {
  return apiRequest('PUT', `${craftPath(craftId)}/${encodeURIComponent(userId)}`, { body, schema: memberSchema });
}

/** DELETE /api/crafts/:craftId/members/:userId (org admins). */
export function removeMember(craftId: string, userId: string): Promise<void> {
  return apiRequest('DELETE', `${craftPath(craftId)}/${encodeURIComponent(userId)}`);
}

/** GET /api/organisation: the caller's organisation, its people and (for admins) its invitations. */
export function getOrganisation(): Promise<OrganisationResponse> {
  return apiRequest('GET', '/api/organisation', { schema: organisationResponseSchema });
}

/** POST /api/organisation/invitations (org admins): invites a person by e-mail. */
export function invitePerson(body: InviteBody): Promise<Invitation> {
  return apiRequest('POST', '/api/organisation/invitations', { body, schema: invitationSchema });
}

/** DELETE /api/organisation/invitations/:invitationId (org admins): withdraws a pending invitation. */
export function withdrawInvitation(invitationId: string): Promise<void> {
  return apiRequest('DELETE', `/api/organisation/invitations/${encodeURIComponent(invitationId)}`);
}

/** PUT /api/organisation/people/:userId/admin (org admins); the last admin cannot be removed (409). */
export function setOrgAdmin(userId: string, isOrgAdmin: boolean): Promise<Person> {
  return apiRequest('PUT', `/api/organisation/people/${encodeURIComponent(userId)}/admin`, { body: { isOrgAdmin }, schema: personSchema });
}
