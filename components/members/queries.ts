import { queryOptions, useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { craftKeys } from '@/components/crafts/queries';
import { sessionKeys } from '@/components/auth/queries';
import type { SetMemberBody } from '@/shared/schemas/members';
import type { InviteBody } from '@/shared/schemas/organisation';
import { getOrganisation, invitePerson, listMembers, removeMember, setMember, setOrgAdmin, withdrawInvitation } from './api';

/** Query keys for craft memberships, general to specific. */
export const memberKeys = {
  all: ['members'] as const,
  list: (craftId: string) => [...memberKeys.all, 'list', craftId] as const,
};

/** Query keys for the organisation (its people and invitations come in one response). */
export const organisationKeys = {
  all: ['organisation'] as const,
  detail: () => [...organisationKeys.all, 'detail'] as const,
};

/** The members of one craft. */
export const memberListOptions = (craftId: string) =>
  queryOptions({ queryKey: memberKeys.list(craftId), queryFn: () => listMembers(craftId) });

/** The caller's organisation, people and invitations. */
export const organisationOptions = () => queryOptions({ queryKey: organisationKeys.detail(), queryFn: getOrganisation });

/** A membership change can change the caller's own role on the craft, so crafts refresh with members. */
function invalidateMemberships(queryClient: QueryClient) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: memberKeys.all }),
    queryClient.invalidateQueries({ queryKey: craftKeys.all }),
  ]);
}

/** Adds a person to a craft or changes their role and subsystems. */
export function useSetMember(craftId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, body }: { userId: string; body: SetMemberBody }) => setMember(craftId, userId, body),
    onSuccess: () => invalidateMemberships(queryClient),
  });
}

/** Removes a member from a craft. */
export function useRemoveMember(craftId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(craftId, userId),
    onSuccess: () => invalidateMemberships(queryClient),
  });
}

/** Invites a person to the organisation. */
export function useInvitePerson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteBody) => invitePerson(body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: organisationKeys.all }),
  });
}

/** Withdraws a pending invitation; it can no longer be accepted. */
export function useWithdrawInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => withdrawInvitation(invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: organisationKeys.all }),
  });
}

/** Grants or withdraws organisation admin; the caller's own session changes if it is them. */
export function useSetOrgAdmin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, isOrgAdmin }: { userId: string; isOrgAdmin: boolean }) => setOrgAdmin(userId, isOrgAdmin),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: organisationKeys.all }),
        queryClient.invalidateQueries({ queryKey: sessionKeys.all }),
      ]),
  });
}
