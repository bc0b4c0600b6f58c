import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Linking, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { formatMoment } from '@/shared/format/moment';
import { auditActions, type AuditAction } from '@/shared/schemas/audit';
import { auditCsvUrl } from './api';
import { auditOptions } from './queries';

/** What each kind of entry records, in words. */
const actionWords: Record<AuditAction, string> = {
  baseline_locked: 'Baseline locked',
  study_opened: 'Study opened',
  study_promoted: 'Study promoted',
  role_changed: 'Role changed',
  token_created: 'Access token created',
  token_revoked: 'Access token revoked',
};

type Filter = AuditAction | 'all';
const filters = [
  { value: 'all' as const, label: 'Everything' },
  ...auditActions.map((action) => ({ value: action, label: actionWords[action] })),
];

/**
 * The craft's audit log (locks, studies, promotions, role and token changes), newest first, filtered by kind,
 * with its export as CSV. For those the permission table lets read it (`viewAudit`).
 */
export function AuditLog({ craftId }: { craftId: string }) {
  const [filter, setFilter] = useState<Filter>('all');
  const action = filter === 'all' ? undefined : filter;
  const audit = useQuery(auditOptions(craftId, action));
  return (
    <Card testID="audit-log">
      <View style={styles.titleRow}>
        <AppText variant="label" style={styles.grow}>
          Audit log
        </AppText>
        <Button
          label="Export CSV"
          tone="secondary"
          onPress={() => void Linking.openURL(auditCsvUrl(craftId, action))}
          testID="audit-export"
        />
      </View>
      <ChoiceChips label="Show" choices={filters} value={filter} onChange={setFilter} testID="audit-filter" />
      {audit.error !== null ? (
        <ErrorState title="Could not load the audit log" message={audit.error.message} onRetry={() => void audit.refetch()} />
      ) : audit.data === undefined ? (
        <LoadingState label="Loading the audit log…" />
      ) : audit.data.length === 0 ? (
        <EmptyState
          title="Nothing recorded"
          message={action === undefined ? 'Locks, studies, role and token changes show here.' : 'No entry of this kind yet.'}
        />
      ) : (
        audit.data.map((event) => (
          <View key={event.id} style={styles.entry} testID="audit-entry">
            <AppText>
              {actionWords[event.action]}: {event.subject}
            </AppText>
            <AppText variant="muted">
              {event.actor?.name ?? 'A former member'} · {formatMoment(event.at)}
            </AppText>
          </View>
        ))
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  entry: { gap: space.xs, paddingVertical: space.xs },
});
