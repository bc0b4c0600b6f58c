import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import type { RowChange } from '@/shared/schemas/compare';
import type { Parameter } from '@/shared/schemas/sheet';
import { CompareTable, MonoText, RowName, TableEntry, TableLine, type Column } from './compare-table';
import { definitionOf, fieldChangeText } from './compare-view';

export type CompareRowsProps = {
  added: readonly Parameter[];
  removed: readonly Parameter[];
  changed: readonly RowChange[];
  /** A dense table on a wide screen, cards on a phone. */
  wide: boolean;
};

const wholeRowColumns: readonly Column[] = [
  { title: 'Row', style: { flex: 2, minWidth: 140 } },
  { title: 'Subsystem', style: { flex: 1, minWidth: 90 } },
  { title: 'Definition', style: { flex: 3, minWidth: 160 } },
];

const changedColumns: readonly Column[] = [
  { title: 'Row', style: { flex: 2, minWidth: 140 } },
  { title: 'Field', style: { flex: 1, minWidth: 80 } },
  { title: 'Old', style: { flex: 2, minWidth: 110 }, numeric: true },
  { title: 'New', style: { flex: 2, minWidth: 110 }, numeric: true },
];

type RowSectionProps<T extends { key: string; label: string }> = {
  title: string;
  rows: readonly T[];
  wide: boolean;
  columns: readonly Column[];
  /** A row's lines in the wide table, a cell per column. */
  lines: (row: T) => ReactNode[][];
  /** A row's card on a phone, under its name. */
  card: (row: T) => ReactNode;
};

/** One kind of row change with its count: a table on a wide screen, a card per row on a phone. */
function RowSection<T extends { key: string; label: string }>({ title, rows, wide, columns, lines, card }: RowSectionProps<T>) {
  if (rows.length === 0) return null;
  return (
    <View style={styles.section}>
      <AppText variant="heading">
        {title} ({rows.length})
      </AppText>
      {wide ? (
        <CompareTable columns={columns}>
          {rows.map((row) => (
            <TableEntry key={row.key} testID={`compare-row-${row.key}`}>
              {lines(row).map((cells, index) => (
                <TableLine key={index} columns={columns} cells={cells} />
              ))}
            </TableEntry>
          ))}
        </CompareTable>
      ) : (
        rows.map((row) => (
          <Card key={row.key} testID={`compare-row-${row.key}`}>
            <RowName label={row.label} rowKey={row.key} />
            {card(row)}
          </Card>
        ))
      )}
    </View>
  );
}

/** Rows present in one revision only: added ones as they are in the newer, removed ones as they were. */
function WholeRows({ title, rows, wide }: { title: string; rows: readonly Parameter[]; wide: boolean }) {
  return (
    <RowSection
      title={title}
      rows={rows}
      wide={wide}
      columns={wholeRowColumns}
      lines={(row) => [
        [
          <RowName key="name" label={row.label} rowKey={row.key} />,
          row.subsystem,
          <MonoText key="definition">{definitionOf(row)}</MonoText>,
        ],
      ]}
      card={(row) => (
        <>
          <AppText variant="muted">{row.subsystem}</AppText>
          <MonoText>{definitionOf(row)}</MonoText>
        </>
      )}
    />
  );
}

/** Rows in both revisions whose definition changed: each changed field, old → new. */
function ChangedRows({ rows, wide }: { rows: readonly RowChange[]; wide: boolean }) {
  return (
    <RowSection
      title="Rows changed"
      rows={rows}
      wide={wide}
      columns={changedColumns}
      lines={(row) =>
        row.changes.map((change, index) => {
          const text = fieldChangeText(change);
          return [index === 0 ? <RowName key="name" label={row.label} rowKey={row.key} /> : '', text.field, text.from, text.to];
        })
      }
      card={(row) =>
        row.changes.map((change) => {
          const text = fieldChangeText(change);
          return (
            <View key={change.field} style={styles.change}>
              <AppText variant="label">{text.field}</AppText>
              <MonoText>{`${text.from} → ${text.to}`}</MonoText>
            </View>
          );
        })
      }
    />
  );
}

/** The rows added, removed and changed between two revisions (after the subsystem filter). */
export function CompareRows({ added, removed, changed, wide }: CompareRowsProps) {
  if (added.length + removed.length + changed.length === 0) {
    return (
      <AppText variant="muted" testID="compare-rows-none">
        No row was added, removed or changed.
      </AppText>
    );
  }
  return (
    <View style={styles.sections}>
      <WholeRows title="Rows added" rows={added} wide={wide} />
      <WholeRows title="Rows removed" rows={removed} wide={wide} />
      <ChangedRows rows={changed} wide={wide} />
    </View>
  );
}

const styles = StyleSheet.create({
  sections: { gap: space.xl },
  section: { gap: space.sm },
  change: { gap: 2, paddingTop: space.xs, borderTopWidth: StyleSheet.hairlineWidth, borderTopColor: colors.rule },
});
