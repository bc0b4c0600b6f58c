import { useQuery } from '@tanstack/react-query';
import { Link } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { ApiError } from '@/components/api/client';
import { useSessionUser } from '@/components/auth/queries';
import { craftOptions } from '@/components/crafts/queries';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { revisionParamsSchema } from '@/shared/schemas/revisions';
import { revisionOptions, useSheetEvents } from './queries';
import { SheetWorkspace } from './sheet-workspace';

function Frame({ title, craftId, children }: { title: string; craftId: string | undefined; children: ReactNode }) {
  const insets = useSafeAreaInsets();
  return (
    <View style={[styles.root, { paddingTop: insets.top }]} testID="sheet-screen">
      <View style={styles.header}>
        <AppText variant="title" style={styles.title} numberOfLines={1}>
          {title}
        </AppText>
        <View style={styles.links}>
          {craftId === undefined ? null : (
            <Link href={`/crafts/${craftId}/revisions`} asChild>
              <Button label="Revisions" tone="quiet" role="link" testID="sheet-revisions" />
            </Link>
          )}
          <Link href={craftId === undefined ? '/crafts' : `/crafts/${craftId}`} asChild>
            <Button label={craftId === undefined ? 'All crafts' : 'Craft'} tone="quiet" role="link" />
          </Link>
        </View>
      </View>
      {children}
    </View>
  );
}

function failure(error: Error, what: string): { title: string; message: string; missing: boolean } {
  const missing = error instanceof ApiError && error.status === 404;
  return missing
    ? { title: `No such ${what}`, message: `This ${what} does not exist, or you may not see it.`, missing }
    : { title: `Could not load the ${what}`, message: error.message, missing };
}

/**
 * A craft's sheet: the working draft, or the revision named (a study to edit, a baseline to read); loaded
 * from the server, evaluated live in the browser, edited row by row.
 */
export function SheetScreen({ craftId, requestedRevisionId }: { craftId: string; requestedRevisionId?: string }) {
  const wellFormed = revisionParamsSchema.safeParse({ craftId, revisionId: requestedRevisionId ?? craftId }).success;
  const craft = useQuery({ ...craftOptions(craftId), enabled: wellFormed });
  const user = useSessionUser();
  const isOrgAdmin = user?.isOrgAdmin ?? false;
  const revisionId = requestedRevisionId ?? craft.data?.draftRevisionId ?? undefined;
  const liveStatus = useSheetEvents(craftId, wellFormed ? revisionId : undefined);
  const revision = useQuery({
    ...revisionOptions(craftId, revisionId ?? '', liveStatus !== 'live'),
    enabled: wellFormed && revisionId !== undefined,
  });

  if (!wellFormed) {
    return (
      <Frame title="Sheet" craftId={undefined}>
        <ErrorState title="No such sheet" message="The address does not name a craft and revision." />
      </Frame>
    );
  }
  if (craft.isPending) {
    return (
      <Frame title="Sheet" craftId={craftId}>
        <LoadingState label="Loading the craft…" />
      </Frame>
    );
  }
  if (craft.isError) {
    const { title, message, missing } = failure(craft.error, 'craft');
    return (
      <Frame title="Sheet" craftId={undefined}>
        <ErrorState title={title} message={message} onRetry={missing ? undefined : () => void craft.refetch()} />
      </Frame>
    );
  }
  const title = `${craft.data.name}: sheet`;
  if (revisionId === undefined) {
    return (
      <Frame title={title} craftId={craftId}>
        <EmptyState title="No working sheet" message="This craft has no working draft to edit yet." />
      </Frame>
    );
  }
  if (revision.isPending) {
    return (
      <Frame title={title} craftId={craftId}>
        <LoadingState label="Loading the sheet…" />
      </Frame>
    );
  }
  if (revision.isError) {
    const { title: problem, message, missing } = failure(revision.error, 'sheet');
    return (
      <Frame title={title} craftId={craftId}>
        <ErrorState title={problem} message={message} onRetry={missing ? undefined : () => void revision.refetch()} />
      </Frame>
    );
  }
  const shown = revision.data.revision;
  return (
    <Frame title={shown.kind === 'draft' ? title : `${craft.data.name}: ${shown.label} (${shown.kind})`} craftId={craftId}>
      <SheetWorkspace
        key={revisionId}
        craft={craft.data}
        detail={revision.data}
        liveStatus={liveStatus}
        isOrgAdmin={isOrgAdmin}
        userId={user?.id}
      />
    </Frame>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.ground },
  header: {
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingTop: space.md,
  },
  title: { flexShrink: 1 },
  links: { flexDirection: 'row', gap: space.xs },
});
