import { useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { formatMoment } from '@/shared/format/moment';
import { formatQuantity, formatUnit } from '@/shared/format/quantity';
import type { RowHistoryEntry, RowState } from '@/shared/schemas/history';
import { rowHistoryOptions } from './queries';
import { definitionText } from './value-input';

/** What a row held, as people read it: "45 m", "=sail_side^2 (m²)", or where the materials library takes it from. */
function holding(state: RowState): string {
  if (state.value !== undefined) return formatQuantity(state.value, state.unit);
  const unit = formatUnit(state.unit);
  return unit === '' ? definitionText(state) : `${definitionText(state)} (${unit})`;
}

/** What a change did to the row, in words, one line a field. */
export function changeLines(entry: Pick<RowHistoryEntry, 'action' | 'before' | 'after'>): string[] {
  const { before, after } = entry;
  if (before === null) return after === null ? [] : [`Added: ${holding(after)}`];
  if (after === null) return [`Deleted (it held ${holding(before)})`];
  const from = (field: string, a: string | undefined, b: string | undefined) => (a === b ? [] : [`${field}: ${a ?? '—'} → ${b ?? '—'}`]);
  const lines = [
    ...(before.key !== after.key ? [`Renamed: ${before.key} → ${after.key}`] : []),
    ...(holding(before) !== holding(after) ? [`${holding(before)} → ${holding(after)}`] : []),
    ...from('Label', before.label, after.label),
    ...from('Subsystem', before.subsystem, after.subsystem),
    ...from('Maturity', before.mass?.maturity, after.mass?.maturity),
    ...(before.note !== after.note ? ['Note changed'] : []),
    ...(before.source !== after.source ? ['Source changed'] : []),
  ];
  if (lines.length > 0) return lines;
  return [entry.action === 'move' ? 'Moved in the sheet order' : 'Changed'];
}

/** Who made the change, when, and in which revision. */
function byline(entry: RowHistoryEntry, revisionId: string): string {
  const where = entry.revision.id === revisionId ? '' : ` · in ${entry.revision.label}`;
  return `${entry.by?.name ?? 'A former member'} · ${formatMoment(entry.at)}${where}`;
}

/**
 * A row's history in the revision, newest first: who changed what, when, from what to what, and in which
 * revision (a baseline's changes were made in the draft, a study's earlier ones in its source).
 */
export function RowHistory({ craftId, revisionId, rowKey }: { craftId: string; revisionId: string; rowKey: string }) {
  const history = useQuery(rowHistoryOptions(craftId, revisionId, rowKey));
  return (
    <View style={styles.section} testID="row-history">
      <AppText variant="label">History</AppText>
      {history.error !== null ? (
        <AppText variant="error">Could not load the history: {history.error.message}</AppText>
      ) : history.data === undefined ? (
        <AppText variant="muted">Loading the history…</AppText>
      ) : history.data.changes.length === 0 ? (
        <AppText variant="muted">No changes recorded: the row is as it was created.</AppText>
      ) : (
        <>
          {history.data.changes.map((entry) => (
            <View key={entry.id} style={styles.entry} testID="row-history-entry">
              {changeLines(entry).map((line) => (
                <AppText key={line}>{line}</AppText>
              ))}
              <AppText variant="muted">{byline(entry, revisionId)}</AppText>
            </View>
          ))}
          {history.data.truncated ? <AppText variant="muted">The {history.data.limit} newest changes are shown.</AppText> : null}
        </>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.sm },
  entry: { gap: space.xs },
});
