import { memo, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { Platform, Pressable, ScrollView, StyleSheet, View, type TextInput, type ViewStyle } from 'react-native';
import { formatUnit } from '@/shared/format/quantity';
import { useLiveRow } from '@/components/sizing/use-sheet-session';
import { AppText } from '@/components/ui/text';
import { colors, fonts, fontSizes, radii, space } from '@/components/ui/theme';
import { computedText, RowNotices, statusText } from './row-feedback';
import { bindRow, type RowBinding, type SheetRowsProps } from './row-binding';
import { groupReadOnlyReason } from './sheet-rows';
import { definitionText, ValueInput, type CellNavigation } from './value-input';

export type SheetTableProps = SheetRowsProps & {
  /** The label of a mass row's maturity id. */
  maturityLabel: (maturity: string) => string;
};

// The subsystem is the group a row sits in, and the key is read under the label: the table fits beside the summary.
const columns = [
  { title: 'Parameter and key', style: { flex: 2.4, minWidth: 140 } },
  { title: 'Value or formula', style: { flex: 2, minWidth: 110 } },
  { title: 'Unit', style: { width: 64 } },
  { title: 'Computed', style: { flex: 1.3, minWidth: 90 }, right: true },
  { title: 'Maturity', style: { flex: 1, minWidth: 70 } },
  { title: 'Status', style: { flex: 1.4, minWidth: 70 } },
  { title: 'Row', style: { width: 48 } },
] as const;

const cell = (index: number) => columns[index]?.style;

// Web only: a row out of view skips layout and paint (its content sized as last laid out, before that as two lines of
// 18 px), and the value field is no flex item, so it lays itself out alone. A keystroke then lays out the rows in view.
const skippedOutOfView = (Platform.OS === 'web' ? { contentVisibility: 'auto', containIntrinsicSize: 'auto 36px' } : {}) as ViewStyle;
const valueCellOnWeb = (Platform.OS === 'web' ? { display: 'block' } : {}) as ViewStyle;

type RowProps = RowBinding & {
  /** The read-only reason said once at the row's group; the row repeats only a reason of its own. */
  groupReason: string | undefined;
  maturityLabel: (maturity: string) => string;
  navigation: CellNavigation;
  onOpenRow: (key: string) => void;
};

/** One table row, subscribed to its own live value: a keystroke elsewhere does not re-render it. */
const SheetTableRow = memo(function SheetTableRow({
  rowKey,
  rows,
  actions,
  access,
  message,
  conflict,
  groupReason,
  maturityLabel,
  navigation,
  onOpenRow,
}: RowProps) {
  const live = useLiveRow(rows, rowKey);
  const { parameter } = live;
  if (parameter === undefined) return null;
  const readOnlyReason = access?.readOnlyReason === groupReason ? undefined : access?.readOnlyReason;
  const status = statusText(live);
  const editable = access?.editable === true && parameter.protected !== true;
  const opens = access?.editable === true || access?.manage === true ? 'Edit' : 'History';
  return (
    <View style={[styles.row, skippedOutOfView]} testID={`sheet-row-${rowKey}`}>
      <View style={styles.cells} role="row">
        <View style={cell(0)} role="cell">
          <AppText style={[styles.cellText, styles.label]} numberOfLines={2}>
            {parameter.label}
          </AppText>
          <AppText style={[styles.mono, styles.faint]} numberOfLines={1}>
            {rowKey}
          </AppText>
        </View>
        <View style={[cell(1), valueCellOnWeb]} role="cell">
          {editable ? (
            <ValueInput
              parameter={parameter}
              computed={live.value?.value}
              invalid={live.rejection !== undefined}
              actions={actions}
              navigation={navigation}
              compact
            />
          ) : (
            <AppText style={[styles.mono, styles.readOnlyValue]} numberOfLines={2}>
              {definitionText(parameter)}
            </AppText>
          )}
        </View>
        <AppText style={[styles.mono, cell(2)]} role="cell">
          {formatUnit(parameter.unit)}
        </AppText>
        <AppText style={[styles.mono, styles.number, cell(3)]} testID={`sheet-value-${rowKey}`} role="cell">
          {computedText(live)}
        </AppText>
        <AppText style={[styles.cellText, styles.small, cell(4)]} numberOfLines={1} role="cell">
          {parameter.mass === undefined ? '' : maturityLabel(parameter.mass.maturity)}
        </AppText>
        <AppText
          style={[styles.small, status.ok ? styles.ok : styles.problem, cell(5)]}
          numberOfLines={3}
          testID={`sheet-status-${rowKey}`}
          role="cell"
        >
          {status.text}
        </AppText>
        <View style={cell(6)} role="cell">
          {/* Everyone opens the row's sheet: editors to change it, readers for its history. */}
          <Pressable
            role="button"
            aria-label={`${opens} ${parameter.label}`}
            onPress={() => onOpenRow(rowKey)}
            style={styles.more}
            testID={`sheet-open-${rowKey}`}
          >
            <AppText style={styles.moreText}>{opens}</AppText>
          </Pressable>
        </View>
      </View>
      {message !== undefined || readOnlyReason !== undefined || conflict !== undefined ? (
        // What is said under the row is a table row of its own, one cell wide, so the table stays a table to assistive technology.
        <View role="row">
          <View role="cell">
            <RowNotices rowKey={rowKey} message={message} readOnlyReason={readOnlyReason} conflict={conflict} actions={actions} />
          </View>
        </View>
      ) : null}
    </View>
  );
});

/**
 * The sheet on a wide screen: a dense table grouped by subsystem (groups fold away), with a header that
 * stays in view. Arrow keys move between the value fields of neighbouring rows, Tab between cells.
 */
export const SheetTable = memo(function SheetTable(props: SheetTableProps) {
  const { groups, access, maturityLabel, onOpenRow } = props;
  const [collapsed, setCollapsed] = useState<ReadonlySet<string>>(new Set());
  const inputs = useRef(new Map<string, TextInput>());
  const order = useRef<string[]>([]);
  useLayoutEffect(() => {
    order.current = groups.filter((group) => !collapsed.has(group.subsystem)).flatMap((group) => group.keys);
  });

  const navigation = useMemo<CellNavigation>(
    () => ({
      register: (key, input) => {
        if (input === null) inputs.current.delete(key);
        else inputs.current.set(key, input);
      },
      move: (key, step) => {
        const keys = order.current.filter((candidate) => inputs.current.has(candidate));
        const next = keys[keys.indexOf(key) + step];
        if (next !== undefined) inputs.current.get(next)?.focus();
      },
    }),
    [],
  );

  const toggle = (subsystem: string) =>
    setCollapsed((now) => {
      const next = new Set(now);
      if (!next.delete(subsystem)) next.add(subsystem);
      return next;
    });

  return (
    <ScrollView style={styles.scroll} stickyHeaderIndices={[0]} testID="sheet-table" role="table">
      <View style={[styles.cells, styles.header]} role="row">
        {columns.map((column, index) => (
          <AppText
            key={column.title || index}
            variant="label"
            style={['right' in column ? styles.number : undefined, column.style]}
            role="columnheader"
          >
            {column.title}
          </AppText>
        ))}
      </View>
      {groups.map((group) => {
        const open = !collapsed.has(group.subsystem);
        const groupReason = groupReadOnlyReason(group, access);
        return (
          <View key={group.subsystem} role="rowgroup">
            <View role="row">
              <View role="rowheader" style={styles.groupCell}>
                <Pressable
                  role="button"
                  aria-expanded={open}
                  onPress={() => toggle(group.subsystem)}
                  style={styles.groupHeader}
                  testID={`sheet-group-${group.subsystem}`}
                >
                  <AppText style={styles.groupTitle}>
                    {open ? '▾' : '▸'} {group.subsystem}
                  </AppText>
                  <AppText variant="muted" style={styles.small}>
                    {group.keys.length} {group.keys.length === 1 ? 'row' : 'rows'}
                  </AppText>
                  {groupReason !== undefined ? (
                    <AppText
                      variant="muted"
                      style={[styles.small, styles.groupReason]}
                      numberOfLines={2}
                      testID={`sheet-group-reason-${group.subsystem}`}
                    >
                      Read-only: {groupReason}.
                    </AppText>
                  ) : null}
                </Pressable>
              </View>
            </View>
            {open
              ? group.keys.map((key) => (
                  <SheetTableRow
                    key={key}
                    {...bindRow(props, key)}
                    groupReason={groupReason}
                    maturityLabel={maturityLabel}
                    navigation={navigation}
                    onOpenRow={onOpenRow}
                  />
                ))
              : null}
          </View>
        );
      })}
    </ScrollView>
  );
});

const styles = StyleSheet.create({
  scroll: { flex: 1, borderWidth: 1, borderColor: colors.rule, borderRadius: radii.md, backgroundColor: colors.panel },
  header: { backgroundColor: colors.recess, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.rule },
  cells: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.md },
  row: { paddingVertical: 3, borderBottomWidth: StyleSheet.hairlineWidth, borderBottomColor: colors.rule, paddingRight: space.md },
  groupCell: { flex: 1 },
  groupHeader: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: 36,
    paddingHorizontal: space.md,
    backgroundColor: colors.ground,
    borderBottomWidth: 1,
    borderBottomColor: colors.rule,
  },
  groupTitle: { fontFamily: fonts.semibold },
  groupReason: { flex: 1, textAlign: 'right' },
  cellText: { fontSize: fontSizes.small, lineHeight: 18 },
  label: { fontFamily: fonts.medium },
  mono: { fontFamily: fonts.mono, fontSize: fontSizes.small, lineHeight: 18, color: colors.ink },
  faint: { color: colors.inkFaint },
  number: { textAlign: 'right' },
  readOnlyValue: { color: colors.inkMuted, textAlign: 'right' },
  small: { fontSize: fontSizes.small, lineHeight: 18 },
  ok: { color: colors.nominal },
  problem: { color: colors.fault },
  more: { minHeight: 32, justifyContent: 'center', alignItems: 'center', borderRadius: radii.sm },
  moreText: { color: colors.film, fontFamily: fonts.semibold, fontSize: fontSizes.small },
});
