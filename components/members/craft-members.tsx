import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { DividedList } from '@/components/ui/divided-list';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import type { Member } from '@/shared/schemas/members';
import { craftRoleLabels } from '@/shared/schemas/roles';
import { MemberEditor } from './member-editor';
import { memberListOptions, organisationOptions, useRemoveMember, useSetMember } from './queries';

export type CraftMembersProps = {
  craftId: string;
  /** Org admins manage membership; everyone else only reads it. */
  canManage: boolean;
};

/** The people on a craft with their roles; org admins add, change and remove them here. */
export function CraftMembers({ craftId, canManage }: CraftMembersProps) {
  const members = useQuery(memberListOptions(craftId));

  return (
    <View style={styles.section}>
      <AppText variant="title">Members</AppText>
      {canManage && members.isSuccess ? <AddMember craftId={craftId} members={members.data} /> : null}
      {members.isPending ? (
        <LoadingState label="Loading members…" />
      ) : members.isError ? (
        <ErrorState title="Could not load the members" message={members.error.message} onRetry={() => void members.refetch()} />
      ) : members.data.length === 0 ? (
        <EmptyState title="No members" message="Nobody has been added to this craft yet." />
      ) : (
        <DividedList testID="member-list">
          {members.data.map((member) => (
            <MemberRow key={member.userId} craftId={craftId} member={member} canManage={canManage} />
          ))}
        </DividedList>
      )}
    </View>
  );
}

function MemberRow({ craftId, member, canManage }: { craftId: string; member: Member; canManage: boolean }) {
  const [mode, setMode] = useState<'view' | 'edit' | 'confirm-remove'>('view');
  const setMember = useSetMember(craftId);
  const removeMember = useRemoveMember(craftId);

  return (
    <View style={styles.row} testID={`member-${member.userId}`}>
      <View style={styles.rowTop}>
        <View style={styles.who}>
          <AppText variant="heading">{member.name}</AppText>
          {member.email === undefined ? null : <AppText variant="mono">{member.email}</AppText>}
        </View>
        <Badge label={craftRoleLabels[member.role]} />
      </View>
      {member.subsystems.length > 0 ? <AppText variant="muted">Subsystems: {member.subsystems.join(', ')}</AppText> : null}
      {canManage && mode === 'view' ? (
        <View style={styles.actions}>
          <Button label="Change role" tone="secondary" aria-label={`Change role of ${member.name}`} onPress={() => setMode('edit')} />
          <Button
            label="Remove"
            tone="quiet"
            aria-label={`Remove ${member.name} from this craft`}
            onPress={() => setMode('confirm-remove')}
          />
        </View>
      ) : null}
      {mode === 'edit' ? (
        <MemberEditor
          initialRole={member.role}
          initialSubsystems={member.subsystems}
          submitLabel="Save role"
          onSubmit={async (body) => {
            await setMember.mutateAsync({ userId: member.userId, body });
            setMode('view');
          }}
          onCancel={() => setMode('view')}
          testID={`member-${member.userId}-editor`}
        />
      ) : null}
      {mode === 'confirm-remove' ? (
        <View style={styles.actions}>
          <Button
            label={`Remove ${member.name}`}
            tone="danger"
            busy={removeMember.isPending}
            onPress={() => removeMember.mutate(member.userId)}
          />
          <Button label="Keep" tone="quiet" onPress={() => setMode('view')} />
          {removeMember.isError ? <AppText variant="error">{removeMember.error.message}</AppText> : null}
        </View>
      ) : null}
    </View>
  );
}

function AddMember({ craftId, members }: { craftId: string; members: readonly Member[] }) {
  const [open, setOpen] = useState(false);
  const [personId, setPersonId] = useState<string | null>(null);
  const organisation = useQuery({ ...organisationOptions(), enabled: open });
  const setMember = useSetMember(craftId);

  if (!open) return <Button label="Add a person" tone="secondary" style={styles.start} onPress={() => setOpen(true)} testID="add-member" />;

  const memberIds = new Set(members.map((member) => member.userId));
  const candidates = (organisation.data?.people ?? []).filter((person) => !memberIds.has(person.id));
  const close = () => {
    setPersonId(null);
    setOpen(false);
  };

  return (
    <Card>
      <AppText variant="heading">Add a person to this craft</AppText>
      {organisation.isPending ? (
        <LoadingState label="Loading people…" />
      ) : organisation.isError ? (
        <ErrorState title="Could not load the people" message={organisation.error.message} onRetry={() => void organisation.refetch()} />
      ) : candidates.length === 0 ? (
        <View style={styles.actions}>
          <AppText variant="muted">Everyone in the organisation is already on this craft.</AppText>
          <Button label="Close" tone="quiet" onPress={close} />
        </View>
      ) : (
        <MemberEditor
          submitLabel="Add to craft"
          onSubmit={async (body) => {
            if (personId === null) throw new Error('Choose the person to add.');
            await setMember.mutateAsync({ userId: personId, body });
            close();
          }}
          onCancel={close}
          testID="add-member"
        >
          <ChoiceChips
            label="Person"
            choices={candidates.map((person) => ({ value: person.id, label: person.name }))}
            value={personId}
            onChange={setPersonId}
            testID="add-member-person"
          />
        </MemberEditor>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  row: { padding: space.lg, gap: space.sm },
  rowTop: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', alignItems: 'center', gap: space.sm },
  who: { flexShrink: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  start: { alignSelf: 'flex-start' },
});
