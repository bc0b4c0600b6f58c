import { useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DividedList } from '@/components/ui/divided-list';
import { FormError } from '@/components/ui/form';
import { Toggle } from '@/components/ui/toggle';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { formatMoment } from '@/shared/format/moment';
import { notificationKinds, type MailPreferences, type NotificationKind } from '@/shared/schemas/notifications';
import { mailPreferencesOptions, notificationListOptions, useMarkNotificationsRead, useSetMailPreferences } from './queries';

const kindLabels: Readonly<Record<NotificationKind, string>> = {
  baseline_locked: 'A baseline is locked on a craft of mine',
  study_promoted: 'A study is promoted into the draft',
  row_changed: 'Someone else changes a row I own (one mail per few minutes)',
};

/** The latest notifications, the unread ones marked, with "mark all read". */
export function NotificationList() {
  const list = useQuery(notificationListOptions());
  const markRead = useMarkNotificationsRead();
  let body;
  if (list.isPending) body = <LoadingState label="Loading notifications…" />;
  else if (list.isError)
    body = <ErrorState title="Notifications could not be loaded" message={list.error.message} onRetry={() => void list.refetch()} />;
  else if (list.data.notifications.length === 0)
    body = <EmptyState title="Nothing yet" message="Locked baselines, promoted studies and others' changes to your rows show here." />;
  else
    body = (
      <DividedList testID="notification-list">
        {list.data.notifications.map((entry) => (
          <View key={entry.id} style={styles.entry} testID={`notification-${entry.id}`}>
            <AppText style={entry.readAt === null ? styles.unread : undefined}>
              {entry.readAt === null ? '● ' : ''}
              {entry.title}
            </AppText>
            <AppText variant="muted" style={styles.body}>
              {entry.body}
            </AppText>
            <AppText variant="muted">{formatMoment(entry.createdAt)}</AppText>
          </View>
        ))}
      </DividedList>
    );
  const unread = list.data?.unread ?? 0;
  return (
    <Card testID="account-notifications">
      <View style={styles.header}>
        <AppText variant="heading" style={styles.grow}>
          Notifications{unread > 0 ? ` (${unread} unread)` : ''}
        </AppText>
        {unread > 0 ? (
          <Button
            label="Mark all read"
            tone="secondary"
            busy={markRead.isPending}
            onPress={() => markRead.mutate(undefined)}
            testID="notifications-read-all"
          />
        ) : null}
      </View>
      <FormError message={markRead.error?.message} />
      {body}
    </Card>
  );
}

/** Which kinds of notification also come by mail, one switch each. */
export function MailPreferencesCard() {
  const preferences = useQuery(mailPreferencesOptions());
  const save = useSetMailPreferences();
  const change = (current: MailPreferences, kind: NotificationKind, on: boolean) => save.mutate({ mail: { ...current.mail, [kind]: on } });
  return (
    <Card testID="account-mail">
      <AppText variant="heading">Mail</AppText>
      <AppText variant="muted">Every notification shows above; choose which also come by e-mail.</AppText>
      {preferences.isPending ? <LoadingState label="Loading…" /> : null}
      {preferences.isError ? <ErrorState title="Mail settings could not be loaded" message={preferences.error.message} /> : null}
      {preferences.data
        ? notificationKinds.map((kind) => (
            <View key={kind} style={styles.preference}>
              <AppText style={styles.grow}>{kindLabels[kind]}</AppText>
              <Toggle
                label={`Mail when: ${kindLabels[kind]}`}
                value={preferences.data.mail[kind]}
                onChange={(on) => change(preferences.data, kind, on)}
                testID={`mail-${kind}`}
              />
            </View>
          ))
        : null}
      <FormError message={save.error?.message} />
    </Card>
  );
}

const styles = StyleSheet.create({
  header: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  entry: { gap: 2, paddingVertical: space.sm },
  unread: { fontFamily: fonts.semibold, color: colors.ink },
  body: { fontFamily: fonts.mono },
  preference: { flexDirection: 'row', alignItems: 'center', gap: space.md },
});
