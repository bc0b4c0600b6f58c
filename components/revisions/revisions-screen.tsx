import { useQuery } from '@tanstack/react-query';
import { Link, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { Linking, StyleSheet, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { useSessionUser } from '@/components/auth/queries';
import { WorkbookExchange } from '@/components/exchange/workbook-exchange';
import { craftOptions } from '@/components/crafts/queries';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { mayOnCraft, type Who } from '@/shared/access/permissions';
import { formatMoment } from '@/shared/format/moment';
import { craftParamsSchema } from '@/shared/schemas/crafts';
import type { Revision } from '@/shared/schemas/revisions';
import { reviewPackUrl } from './api';
import { AuditLog } from './audit-log';
import { PromotePanel } from './promote-panel';
import { revisionListOptions } from './queries';
import { LockBaselineForm, OpenStudyForm } from './revision-forms';

/** What is open below a revision: a form or the promotion of a study. */
type Opened = { action: 'lock' | 'study' | 'promote' | 'exchange'; revisionId: string };

/** Where a revision's sheet opens: the draft's own address, or the sheet of that revision. */
function sheetHref(craftId: string, revision: Revision): Href {
  return revision.kind === 'draft' ? `/crafts/${craftId}/sheet` : `/crafts/${craftId}/sheet?revision=${revision.id}`;
}

function compareHref(craftId: string, from: string, to: string): Href {
  return `/crafts/${craftId}/compare?from=${from}&to=${to}`;
}

type RevisionCardProps = {
  craftId: string;
  revision: Revision;
  /** What it compares with by default: a baseline with the draft, a study with its parent. */
  compareWith: string | undefined;
  who: Who;
  opened: Opened | undefined;
  onOpen: (opened: Opened | undefined) => void;
};

function RevisionCard({ craftId, revision, compareWith, who, opened, onOpen }: RevisionCardProps) {
  const router = useRouter();
  const open = revision.state === 'open';
  const canLock = revision.kind === 'draft' && mayOnCraft('lockBaseline', who);
  const canPromote = revision.kind === 'study' && open && mayOnCraft('promoteStudy', who);
  const here = opened?.revisionId === revision.id ? opened.action : undefined;
  const close = () => onOpen(undefined);
  return (
    <View style={styles.item} testID={`revision-${revision.id}`}>
      <View style={styles.titleRow}>
        <AppText variant="heading" style={styles.grow}>
          {revision.label}
        </AppText>
        <Badge label={revision.kind === 'study' && !open ? 'study, promoted' : revision.kind} strong={revision.kind === 'baseline'} />
      </View>
      <AppText variant="muted">
        {revision.lockedAt !== null
          ? `Locked by ${revision.lockedBy?.name ?? 'a former member'} on ${formatMoment(revision.lockedAt)}`
          : revision.kind === 'study'
            ? `Opened by ${revision.createdBy?.name ?? 'a former member'} on ${formatMoment(revision.createdAt)}`
            : `Last changed ${formatMoment(revision.updatedAt)}`}
      </AppText>
      {revision.note.trim() !== '' ? <AppText>{revision.note}</AppText> : null}
      <View style={styles.actions}>
        <Link href={sheetHref(craftId, revision)} asChild>
          <Button
            label={open ? 'Open the sheet' : 'View the sheet'}
            tone="secondary"
            role="link"
            testID={`revision-sheet-${revision.id}`}
          />
        </Link>
        {compareWith !== undefined ? (
          <Link
            href={compareHref(
              craftId,
              revision.kind === 'baseline' ? revision.id : compareWith,
              revision.kind === 'baseline' ? compareWith : revision.id,
            )}
            asChild
          >
            <Button
              label={revision.kind === 'baseline' ? 'Compare with the draft' : 'Compare with where it began'}
              tone="secondary"
              role="link"
              testID={`revision-compare-${revision.id}`}
            />
          </Link>
        ) : null}
        {revision.kind === 'baseline' ? (
          <Button
            label="Review pack (PDF)"
            tone="secondary"
            onPress={() => void Linking.openURL(reviewPackUrl(craftId, revision.id))}
            testID={`revision-pack-${revision.id}`}
          />
        ) : null}
        <Button
          label="Spreadsheet exchange"
          tone="secondary"
          onPress={() => onOpen(here === 'exchange' ? undefined : { action: 'exchange', revisionId: revision.id })}
          testID={`revision-exchange-${revision.id}`}
        />
        {canLock ? (
          <Button label="Lock as baseline" onPress={() => onOpen({ action: 'lock', revisionId: revision.id })} testID="revision-lock" />
        ) : null}
        {mayOnCraft('openStudy', who) ? (
          <Button
            label="Open a study"
            tone="secondary"
            onPress={() => onOpen({ action: 'study', revisionId: revision.id })}
            testID={`revision-study-${revision.id}`}
          />
        ) : null}
        {canPromote ? (
          <Button
            label="Promote into the draft"
            onPress={() => onOpen({ action: 'promote', revisionId: revision.id })}
            testID={`revision-promote-${revision.id}`}
          />
        ) : null}
      </View>
      {here === 'lock' ? <LockBaselineForm craftId={craftId} from={revision} onDone={close} /> : null}
      {here === 'study' ? (
        <OpenStudyForm craftId={craftId} from={revision} onDone={close} onOpened={(study) => router.push(sheetHref(craftId, study))} />
      ) : null}
      {here === 'promote' ? <PromotePanel craftId={craftId} study={revision} onDone={close} /> : null}
      {here === 'exchange' ? <WorkbookExchange craftId={craftId} revision={revision} who={who} onDone={close} /> : null}
    </View>
  );
}

function Section({ title, children, testID }: { title: string; children: React.ReactNode; testID: string }) {
  return (
    <Card testID={testID}>
      <AppText variant="label">{title}</AppText>
      {children}
    </Card>
  );
}

/**
 * A craft's revisions: the working draft (lock it as a baseline), the locked baselines (their review packs,
 * compared with the draft), the studies (open, compare, promote) and the audit log. Each action shows only to
 * those the permission table allows.
 */
export function RevisionsScreen({ craftId }: { craftId: string }) {
  const wellFormed = craftParamsSchema.safeParse({ craftId }).success;
  const craft = useQuery({ ...craftOptions(craftId), enabled: wellFormed });
  const revisions = useQuery({ ...revisionListOptions(craftId), enabled: wellFormed });
  const isOrgAdmin = useSessionUser()?.isOrgAdmin ?? false;
  const [opened, setOpened] = useState<Opened>();
  const back = (
    <Link href={wellFormed ? `/crafts/${craftId}` : '/crafts'} asChild>
      <Button label={wellFormed ? 'Craft' : 'All crafts'} tone="quiet" role="link" />
    </Link>
  );

  if (!wellFormed) {
    return (
      <Screen title="Revisions" aside={back}>
        <ErrorState title="No such craft" message={`“${craftId}” in the address is not a craft identifier.`} />
      </Screen>
    );
  }
  const failed = craft.error ?? revisions.error;
  if (failed !== null) {
    const missing = failed instanceof ApiError && failed.status === 404;
    return (
      <Screen title="Revisions" aside={back}>
        <ErrorState
          title={missing ? 'No such craft' : 'Could not load the revisions'}
          message={missing ? 'This craft does not exist, or you may not see it.' : failed.message}
          onRetry={missing ? undefined : () => void Promise.all([craft.refetch(), revisions.refetch()])}
        />
      </Screen>
    );
  }
  if (craft.data === undefined || revisions.data === undefined) {
    return (
      <Screen title="Revisions" aside={back}>
        <LoadingState label="Loading the revisions…" />
      </Screen>
    );
  }

  const who: Who = { role: craft.data.myRole, isOrgAdmin };
  const draft = revisions.data.find((revision) => revision.kind === 'draft');
  const newestFirst = (kind: Revision['kind']) => revisions.data.filter((revision) => revision.kind === kind).reverse();
  const card = (revision: Revision, compareWith: string | undefined) => (
    <RevisionCard
      key={revision.id}
      craftId={craftId}
      revision={revision}
      compareWith={compareWith}
      who={who}
      opened={opened}
      onOpen={setOpened}
    />
  );
  const baselines = newestFirst('baseline');
  const studies = newestFirst('study');
  return (
    <Screen title={`${craft.data.name}: revisions`} aside={back}>
      {draft !== undefined ? (
        <Section title="Working draft" testID="revisions-draft">
          {card(draft, undefined)}
        </Section>
      ) : null}
      <Section title="Baselines" testID="revisions-baselines">
        {baselines.length === 0 ? (
          <EmptyState title="No baseline yet" message="A chief engineer locks the draft as a baseline for a design review." />
        ) : (
          baselines.map((baseline) => card(baseline, draft?.id))
        )}
      </Section>
      <Section title="Studies" testID="revisions-studies">
        {studies.length === 0 ? (
          <EmptyState title="No study yet" message="Open a study from any revision to try changes without touching the draft." />
        ) : (
          studies.map((study) => card(study, study.parentId ?? undefined))
        )}
      </Section>
      {mayOnCraft('viewAudit', who) ? <AuditLog craftId={craftId} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  item: { gap: space.sm, paddingVertical: space.sm },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
