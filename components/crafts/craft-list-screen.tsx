import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useSessionUser } from '@/components/auth/queries';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { CraftCard } from './craft-card';
import { CraftForm } from './craft-form';
import { craftListOptions, useCreateCraft } from './queries';

/** The crafts the signed-in person works on; org admins can start a new one here. */
export function CraftListScreen() {
  const user = useSessionUser();
  const crafts = useQuery(craftListOptions());
  const isOrgAdmin = user?.isOrgAdmin ?? false;

  return (
    <Screen title="Crafts" subtitle={user ? user.organisation.name : undefined}>
      {isOrgAdmin ? <NewCraft /> : null}
      <View testID="craft-list" style={styles.list}>
        {crafts.isPending ? (
          <LoadingState label="Loading crafts…" />
        ) : crafts.isError ? (
          <ErrorState title="Could not load the crafts" message={crafts.error.message} onRetry={() => void crafts.refetch()} />
        ) : crafts.data.length === 0 ? (
          <EmptyState
            title="No crafts yet"
            message={isOrgAdmin ? 'Start the first craft with “New craft”.' : 'An organisation admin can add you to a craft.'}
          />
        ) : (
          crafts.data.map((craft) => <CraftCard key={craft.id} craft={craft} />)
        )}
      </View>
    </Screen>
  );
}

function NewCraft() {
  const [open, setOpen] = useState(false);
  const createCraft = useCreateCraft();
  if (!open) return <Button label="New craft" onPress={() => setOpen(true)} style={styles.newButton} testID="new-craft" />;
  return (
    <Card>
      <AppText variant="heading">New craft</AppText>
      <CraftForm
        submitLabel="Create craft"
        onSubmit={(body) => createCraft.mutateAsync(body)}
        onSaved={() => setOpen(false)}
        onCancel={() => setOpen(false)}
        testID="new-craft"
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  newButton: { alignSelf: 'flex-start' },
});
