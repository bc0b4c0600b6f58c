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
import { mayInOrganisation } from '@/shared/access/permissions';
import { CraftCard } from './craft-card';
import { CraftForm } from './craft-form';
import { CraftOriginChooser, type CraftOrigin } from './craft-origin-chooser';
import { craftListOptions, templateListOptions, useCreateCraft } from './queries';

/** The crafts the signed-in person works on; those who may create crafts start a new one here. */
export function CraftListScreen() {
  const user = useSessionUser();
  const crafts = useQuery(craftListOptions());
  const mayCreate = user !== null && mayInOrganisation('createCraft', user);

  return (
    <Screen title="Crafts" subtitle={user ? user.organisation.name : undefined}>
      {mayCreate ? <NewCraft /> : null}
      <View testID="craft-list" style={styles.list}>
        {crafts.isPending ? (
          <LoadingState label="Loading crafts…" />
        ) : crafts.isError ? (
          <ErrorState title="Could not load the crafts" message={crafts.error.message} onRetry={() => void crafts.refetch()} />
        ) : crafts.data.length === 0 ? (
          <EmptyState
            title="No crafts yet"
            message={mayCreate ? 'Start the first craft with “New craft”.' : 'An organisation admin can add you to a craft.'}
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
  const [chosen, setChosen] = useState<CraftOrigin | null>(null);
  const templates = useQuery({ ...templateListOptions(), enabled: open });
  const createCraft = useCreateCraft();
  if (!open) return <Button label="New craft" onPress={() => setOpen(true)} style={styles.newButton} testID="new-craft" />;
  // Until the person chooses, the first template is the natural start.
  const firstTemplate = templates.data?.[0];
  const origin = chosen ?? (firstTemplate === undefined ? null : { templateId: firstTemplate.id });
  return (
    <Card testID="new-craft-card">
      <AppText variant="heading">New craft</AppText>
      <CraftOriginChooser value={origin} onChange={setChosen} />
      <CraftForm
        submitLabel="Create craft"
        onSubmit={(body) => createCraft.mutateAsync({ ...body, ...origin })}
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
