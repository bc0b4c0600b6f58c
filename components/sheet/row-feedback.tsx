import { StyleSheet, View } from 'react-native';
import { formatQuantity } from '@/shared/format/quantity';
import type { LiveRow } from '@/components/sizing/use-sheet-session';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { colors, fonts, fontSizes, radii, space } from '@/components/ui/theme';
import type { RevisionParameter } from '@/shared/schemas/revisions';
import type { RowConflict, RowFields, RowMessage, SheetActions } from './use-sheet-editor';

/** The computed value as people read it: a few significant figures, an SI prefix, "—" while the row has no value. */
export function computedText(row: LiveRow): string {
  return row.value === undefined ? '—' : formatQuantity(row.value.value, row.value.unit);
}

/** The row's status in words: "ok", or what the engine says is wrong (with what was typed, if it was refused). */
export function statusText(row: LiveRow): { ok: boolean; text: string } {
  if (row.rejection !== undefined) return { ok: false, text: `Not accepted: ${row.rejection.error.message}` };
  if (row.error !== undefined) return { ok: false, text: row.error.message };
  return { ok: true, text: 'ok' };
}

function fieldsText(fields: RowFields, unit: string): string {
  const parts: string[] = [];
  if (fields.formula !== undefined) parts.push(fields.formula);
  if (fields.value !== undefined)
    parts.push(typeof fields.value === 'number' ? formatQuantity(fields.value, fields.unit ?? unit, 10) : fields.value);
  if (fields.unit !== undefined && fields.value === undefined) parts.push(`unit ${fields.unit}`);
  if (fields.label !== undefined) parts.push(`label “${fields.label}”`);
  if (fields.subsystem !== undefined) parts.push(`in ${fields.subsystem}`);
  if (fields.mass !== undefined) parts.push(fields.mass === null ? 'no mass' : `maturity ${fields.mass.maturity}`);
  return parts.join(', ') || 'your change';
}

function rowText(row: RevisionParameter): string {
  if (row.formula !== undefined) return row.formula;
  return row.value === undefined ? 'a value from the materials library' : formatQuantity(row.value, row.unit, 10);
}

/** Someone saved the row first: their copy beside the person's, and a choice between them. */
export function ConflictPanel({ rowKey, conflict, actions }: { rowKey: string; conflict: RowConflict; actions: SheetActions }) {
  const by = conflict.current.updatedBy?.name ?? 'Someone';
  return (
    <View style={styles.conflict} role="alert" testID={`sheet-conflict-${rowKey}`}>
      <AppText style={styles.strong}>{by} changed this row while you were editing it.</AppText>
      <View style={styles.versions}>
        <View style={styles.version}>
          <AppText variant="label">Yours</AppText>
          <AppText style={styles.mono}>{fieldsText(conflict.mine, conflict.current.unit)}</AppText>
        </View>
        <View style={styles.version}>
          <AppText variant="label">Now saved</AppText>
          <AppText style={styles.mono}>{rowText(conflict.current)}</AppText>
        </View>
      </View>
      <View style={styles.buttons}>
        <Button label="Keep mine" tone="secondary" onPress={() => actions.keepMine(rowKey)} testID="conflict-keep-mine" />
        <Button label="Take theirs" tone="quiet" onPress={() => actions.takeTheirs(rowKey)} testID="conflict-take-theirs" />
      </View>
    </View>
  );
}

export type RowNoticesProps = {
  rowKey: string;
  message: RowMessage | undefined;
  readOnlyReason: string | undefined;
  conflict: RowConflict | undefined;
  actions: SheetActions;
};

/** What is said under a row: a refused save or delete (with the rows still reading it), why it is read-only, a conflict. */
export function RowNotices({ rowKey, message, readOnlyReason, conflict, actions }: RowNoticesProps) {
  if (message === undefined && readOnlyReason === undefined && conflict === undefined) return null;
  return (
    <View style={styles.notices}>
      {message !== undefined ? (
        <AppText variant="error" role="alert" testID={`sheet-row-message-${rowKey}`}>
          {message.text}
          {message.usedBy !== undefined && message.usedBy.length > 0 ? ` Rows that use it: ${message.usedBy.join(', ')}.` : ''}
        </AppText>
      ) : readOnlyReason !== undefined ? (
        <AppText variant="muted" style={styles.small} testID={`sheet-row-message-${rowKey}`}>
          Read-only: {readOnlyReason}.
        </AppText>
      ) : null}
      {conflict !== undefined ? <ConflictPanel rowKey={rowKey} conflict={conflict} actions={actions} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  notices: { gap: space.xs, paddingTop: space.xs },
  small: { fontSize: fontSizes.small, lineHeight: 18 },
  conflict: {
    gap: space.sm,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.film,
    backgroundColor: colors.filmWash,
  },
  strong: { fontFamily: fonts.semibold },
  versions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  version: { flexBasis: 200, flexGrow: 1, gap: 2 },
  mono: { fontFamily: fonts.mono, fontSize: fontSizes.small },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
