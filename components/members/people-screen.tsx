import { useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { useSessionUser } from '@/components/auth/queries';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DividedList } from '@/components/ui/divided-list';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';
import { space } from '@/components/ui/theme';
import { mayInOrganisation } from '@/shared/access/permissions';
import type { Invitation, Person } from '@/shared/schemas/organisation';
import { InviteForm } from './invite-form';
import { organisationOptions, useSetOrgAdmin, useWithdrawInvitation } from './queries';

/** Organisation admins: the organisation's people, who is an admin, and invitations. */
export function PeopleScreen() {
  const organisation = useQuery(organisationOptions());
  const user = useSessionUser();

  if (user === null || !mayInOrganisation('invitePeople', user)) {
    return (
      <Screen title="People">
        <EmptyState title="For organisation admins" message="Only organisation admins manage people and invitations." />
      </Screen>
    );
  }

  return (
    <Screen title="People" subtitle={organisation.data?.organisation.name}>
      {organisation.isPending ? (
        <LoadingState label="Loading people…" />
      ) : organisation.isError ? (
        <ErrorState
          title="Could not load the organisation"
          message={organisation.error.message}
          onRetry={() => void organisation.refetch()}
        />
      ) : (
        <>
          <DividedList testID="people-list">
            {organisation.data.people.length === 0 ? (
              <EmptyState title="No people" message="Invite someone below." />
            ) : (
              organisation.data.people.map((person) => (
                <PersonRow key={person.id} person={person} canSetAdmin={mayInOrganisation('setOrgAdmin', user)} />
              ))
            )}
          </DividedList>
          <Card>
            <AppText variant="title">Invite a person</AppText>
            <InviteForm />
          </Card>
          <View style={styles.section}>
            <AppText variant="title">Invitations</AppText>
            {organisation.data.invitations.length === 0 ? (
              <EmptyState title="No invitations" message="Invitations you send appear here." />
            ) : (
              <DividedList testID="invitation-list">
                {organisation.data.invitations.map((invitation) => (
                  <InvitationRow key={invitation.id} invitation={invitation} />
                ))}
              </DividedList>
            )}
          </View>
        </>
      )}
    </Screen>
  );
}

function PersonRow({ person, canSetAdmin }: { person: Person; canSetAdmin: boolean }) {
  const setOrgAdmin = useSetOrgAdmin();
  return (
    <View style={styles.row} testID={`org-person-${person.id}`}>
      <View style={styles.who}>
        <AppText variant="heading">{person.name}</AppText>
        <AppText variant="mono">{person.email}</AppText>
        {setOrgAdmin.isError ? <AppText variant="error">{setOrgAdmin.error.message}</AppText> : null}
      </View>
      <View style={styles.toggle}>
        <AppText variant="label">Admin</AppText>
        <Toggle
          label={`Organisation admin: ${person.name}`}
          value={person.isOrgAdmin ?? false}
          disabled={!canSetAdmin || setOrgAdmin.isPending}
          onChange={(isOrgAdmin) => setOrgAdmin.mutate({ userId: person.id, isOrgAdmin })}
          testID={`org-person-${person.id}-admin`}
        />
      </View>
    </View>
  );
}

const providerNames: Readonly<Record<NonNullable<Invitation['provider']>, string>> = { google: 'Google', sso: 'Company SSO' };

/** Where an invitation stands, in a word for its badge. */
function invitationState(invitation: Invitation): 'Accepted' | 'Withdrawn' | 'Waiting' {
  if (invitation.acceptedAt) return 'Accepted';
  return invitation.withdrawnAt ? 'Withdrawn' : 'Waiting';
}

function InvitationRow({ invitation }: { invitation: Invitation }) {
  const withdraw = useWithdrawInvitation();
  const state = invitationState(invitation);
  return (
    <View style={styles.row} testID={`invitation-${invitation.id}`}>
      <View style={styles.who}>
        <AppText variant="heading">{invitation.name}</AppText>
        <AppText variant="mono">{invitation.email}</AppText>
        <AppText variant="muted">
          Invited by {invitation.invitedBy} on <AppText variant="mono">{invitation.createdAt.slice(0, 10)}</AppText>
          {invitation.provider ? ` · signs in with ${providerNames[invitation.provider]}` : ''}
        </AppText>
        {withdraw.isError ? <AppText variant="error">{withdraw.error.message}</AppText> : null}
      </View>
      <View style={styles.toggle}>
        <Badge label={state} strong={state === 'Waiting'} />
        {state === 'Waiting' ? (
          <Button
            label="Withdraw"
            tone="secondary"
            aria-label={`Withdraw the invitation to ${invitation.email}`}
            busy={withdraw.isPending}
            onPress={() => withdraw.mutate(invitation.id)}
            testID={`withdraw-invitation-${invitation.id}`}
          />
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    padding: space.lg,
  },
  who: { flexShrink: 1, gap: 2 },
  toggle: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
