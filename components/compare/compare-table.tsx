import type { ReactNode } from 'react';
import { StyleSheet, View, type ViewStyle } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, fonts, fontSizes, radii, space } from '@/components/ui/theme';

/** A column of a comparison table: its heading, its share of the width, and whether it holds numbers (right-aligned). */
export type Column = { title: string; style: ViewStyle; numeric?: boolean };

/** A dense table for a wide screen: a heading row, then the rows given as children. It never scrolls by itself, so it prints whole. */
export function CompareTable({ columns, children, testID }: { columns: readonly Column[]; children: ReactNode; testID?: string }) {
  return (
    <View style={styles.table} role="table" testID={testID}>
      <View style={[styles.cells, styles.header]} role="row">
        {columns.map((column) => (
          <AppText key={column.title} variant="label" role="columnheader" style={[column.style, column.numeric && styles.numeric]}>
            {column.title}
          </AppText>
        ))}
      </View>
      {children}
    </View>
  );
}

/** One line of a comparison table: a cell per column, numbers in Roboto Mono and right-aligned. */
export function TableLine({ columns, cells }: { columns: readonly Column[]; cells: readonly ReactNode[] }) {
  return (
    <View style={styles.cells} role="row">
      {columns.map((column, index) => {
        const content = cells[index];
        return (
          <View key={column.title} style={column.style} role="cell">
            {typeof content === 'string' ? (
              <AppText style={column.numeric ? [styles.mono, styles.numeric] : styles.text}>{content}</AppText>
            ) : (
              content
            )}
          </View>
        );
      })}
    </View>
  );
}

/** One entry of a table (a row, or a row's several changed fields), set off from the one above by a rule. */
export function TableEntry({ children, testID }: { children: ReactNode; testID?: string }) {
  return (
    <View style={styles.entry} role="rowgroup" testID={testID}>
      {children}
    </View>
  );
}

/** A row's label with its key under it, for a table's first cell or a card's heading. */
export function RowName({ label, rowKey }: { label: string; rowKey: string }) {
  return (
    <View>
      <AppText style={[styles.text, styles.name]}>{label}</AppText>
      <AppText style={[styles.mono, styles.faint]}>{rowKey}</AppText>
    </View>
  );
}

/** Text in Roboto Mono at the table's size: values and formulas. */
export function MonoText({ children, testID }: { children: string; testID?: string }) {
  return (
    <AppText style={styles.mono} testID={testID}>
      {children}
    </AppText>
  );
}

const styles = StyleSheet.create({
  table: { borderWidth: 1, borderColor: colors.rule, borderRadius: radii.md, backgroundColor: colors.panel, overflow: 'hidden' },
  header: { backgroundColor: colors.recess, borderBottomWidth: 1, borderBottomColor: colors.rule },
  cells: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: space.sm,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
  },
  entry: { borderTopWidth: StyleSheet.hairlineWidth, borderTopColor: colors.rule },
  text: { fontSize: fontSizes.small, lineHeight: 18 },
  name: { fontFamily: fonts.medium },
  mono: { fontFamily: fonts.mono, fontSize: fontSizes.small, lineHeight: 18, color: colors.ink, fontVariant: ['tabular-nums'] },
  numeric: { textAlign: 'right' },
  faint: { color: colors.inkFaint },
});
