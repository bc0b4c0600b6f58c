import { useQuery } from '@tanstack/react-query';
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { useSessionUser } from '@/components/auth/queries';
import { CraftMembers } from '@/components/members/craft-members';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { mayOnCraft } from '@/shared/access/permissions';
import { craftParamsSchema, type Craft } from '@/shared/schemas/crafts';
import { CraftForm } from './craft-form';
import { craftOptions, useUpdateCraft } from './queries';
import { myRoleLabel } from './role-label';

/** One craft: what it is, the caller's role, and its members. */
export function CraftScreen({ craftId }: { craftId: string }) {
  // A malformed id in the address is answered here, without asking the server about it.
  const wellFormed = craftParamsSchema.safeParse({ craftId }).success;
  const craft = useQuery({ ...craftOptions(craftId), enabled: wellFormed });
  const isOrgAdmin = useSessionUser()?.isOrgAdmin ?? false;
  const back = (
    <Link href="/crafts" asChild>
      <Button label="All crafts" tone="quiet" role="link" />
    </Link>
  );

  if (!wellFormed) {
    return (
      <Screen title="Craft" aside={back}>
        <ErrorState title="No such craft" message={`“${craftId}” in the address is not a craft identifier.`} />
      </Screen>
    );
  }
  if (craft.isPending) {
    return (
      <Screen title="Craft" aside={back}>
        <LoadingState label="Loading the craft…" />
      </Screen>
    );
  }
  if (craft.isError) {
    const missing = craft.error instanceof ApiError && craft.error.status === 404;
    return (
      <Screen title="Craft" aside={back}>
        <ErrorState
          title={missing ? 'No such craft' : 'Could not load the craft'}
          message={missing ? 'This craft does not exist, or it belongs to another organisation.' : craft.error.message}
          onRetry={missing ? undefined : () => void craft.refetch()}
        />
      </Screen>
    );
  }

  const who = { role: craft.data.myRole, isOrgAdmin };
  return (
    <Screen title={craft.data.name} aside={back}>
      <CraftSummary craft={craft.data} canEdit={mayOnCraft('editCraftDetails', who)} />
      <View style={styles.links}>
        <Link href={`/crafts/${craftId}/sheet`} asChild>
          <Button label="Open the sheet" role="link" testID="craft-open-sheet" />
        </Link>
        <Link href={`/crafts/${craftId}/revisions`} asChild>
          <Button label="Revisions" tone="secondary" role="link" testID="craft-open-revisions" />
        </Link>
        <Link href={`/crafts/${craftId}/compare`} asChild>
          <Button label="Compare revisions" tone="secondary" role="link" testID="craft-open-compare" />
        </Link>
      </View>
      <CraftMembers craftId={craftId} canManage={mayOnCraft('manageMembers', who)} />
    </Screen>
  );
}

function CraftSummary({ craft, canEdit }: { craft: Craft; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const updateCraft = useUpdateCraft(craft.id);

  if (editing) {
    return (
      <Card>
        <AppText variant="heading">Edit craft</AppText>
        <CraftForm
          initialValues={{ name: craft.name, description: craft.description }}
          submitLabel="Save"
          onSubmit={(body) => updateCraft.mutateAsync(body)}
          onSaved={() => setEditing(false)}
          onCancel={() => setEditing(false)}
          testID="edit-craft"
        />
      </Card>
    );
  }
  return (
    <Card testID="craft-summary">
      <View style={styles.row}>
        <AppText variant="label">Your role</AppText>
        <Badge label={myRoleLabel(craft.myRole)} strong />
      </View>
      <AppText>{craft.description || 'No description yet.'}</AppText>
      <AppText variant="mono">
        Created {craft.createdAt.slice(0, 10)} · updated {craft.updatedAt.slice(0, 10)}
      </AppText>
      {canEdit ? (
        <Button
          label="Edit name and description"
          tone="secondary"
          style={styles.start}
          onPress={() => setEditing(true)}
          testID="edit-craft"
        />
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  start: { alignSelf: 'flex-start' },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
