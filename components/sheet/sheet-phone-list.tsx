import { memo } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useLiveRow } from '@/components/sizing/use-sheet-session';
import { AppText } from '@/components/ui/text';
import { colors, fonts, fontSizes, radii, space, touchTarget } from '@/components/ui/theme';
import { computedText, RowNotices, statusText } from './row-feedback';
import { bindRow, type RowBinding, type SheetRowsProps } from './row-binding';
import { groupReadOnlyReason } from './sheet-rows';

export type SheetPhoneListProps = SheetRowsProps & {
  /** The row whose edit sheet is open: its notices show there instead. */
  openKey: string | undefined;
};

type ItemProps = RowBinding & {
  /** The read-only reason said once under the group's heading; the row repeats only a reason of its own. */
  groupReason: string | undefined;
  open: boolean;
  onOpenRow: (key: string) => void;
};

const PhoneRow = memo(function PhoneRow({ rowKey, rows, actions, access, message, conflict, groupReason, open, onOpenRow }: ItemProps) {
  const live = useLiveRow(rows, rowKey);
  if (live.parameter === undefined) return null;
  const readOnlyReason = access?.readOnlyReason === groupReason ? undefined : access?.readOnlyReason;
  const status = statusText(live);
  return (
    <View style={styles.item} testID={`sheet-row-${rowKey}`}>
      <Pressable role="button" onPress={() => onOpenRow(rowKey)} style={({ pressed }) => [styles.press, pressed && styles.pressed]}>
        <View style={styles.text}>
          <AppText style={styles.label} numberOfLines={2}>
            {live.parameter.label}
          </AppText>
          <AppText variant="mono" numberOfLines={1}>
            {rowKey}
          </AppText>
        </View>
        <View style={styles.figures}>
          <AppText style={styles.value} testID={`sheet-value-${rowKey}`}>
            {computedText(live)}
          </AppText>
          <AppText style={[styles.status, status.ok ? styles.ok : styles.problem]} numberOfLines={2} testID={`sheet-status-${rowKey}`}>
            {status.text}
          </AppText>
        </View>
      </Pressable>
      {open ? null : <RowNotices rowKey={rowKey} message={message} readOnlyReason={readOnlyReason} conflict={conflict} actions={actions} />}
    </View>
  );
});

/** The sheet on a phone: rows by subsystem as a list; a tap opens the row's edit sheet. */
export const SheetPhoneList = memo(function SheetPhoneList(props: SheetPhoneListProps) {
  const { groups, access, openKey, onOpenRow } = props;
  return (
    <View style={styles.list}>
      {groups.map((group) => {
        const groupReason = groupReadOnlyReason(group, access);
        return (
          <View key={group.subsystem} style={styles.group}>
            <AppText variant="label" role="heading" aria-level={3}>
              {group.subsystem}
            </AppText>
            {groupReason !== undefined ? (
              <AppText variant="muted" style={styles.groupReason} testID={`sheet-group-reason-${group.subsystem}`}>
                Read-only: {groupReason}.
              </AppText>
            ) : null}
            <View style={styles.card}>
              {group.keys.map((key) => (
                <PhoneRow key={key} {...bindRow(props, key)} groupReason={groupReason} open={openKey === key} onOpenRow={onOpenRow} />
              ))}
            </View>
          </View>
        );
      })}
    </View>
  );
});

const styles = StyleSheet.create({
  list: { gap: space.lg },
  group: { gap: space.xs },
  groupReason: { fontSize: fontSizes.small, lineHeight: 18 },
  card: { backgroundColor: colors.panel, borderColor: colors.rule, borderWidth: 1, borderRadius: radii.md },
  item: {
    borderBottomWidth: StyleSheet.hairlineWidth,
    borderBottomColor: colors.rule,
    paddingHorizontal: space.md,
    paddingBottom: space.xs,
  },
  press: { minHeight: touchTarget, flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.sm },
  pressed: { backgroundColor: colors.recess },
  text: { flex: 1, minWidth: 0 },
  label: { fontFamily: fonts.medium },
  figures: { alignItems: 'flex-end', maxWidth: '50%' },
  value: { fontFamily: fonts.mono, fontSize: fontSizes.body, textAlign: 'right' },
  status: { fontSize: fontSizes.small, lineHeight: 18, textAlign: 'right' },
  ok: { color: colors.nominal },
  problem: { color: colors.fault },
});
