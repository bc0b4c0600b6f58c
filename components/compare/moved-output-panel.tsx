import { useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ShareBars, type Share } from '@/components/ui/share-bars';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';
import type { InputShare, MovedOutput } from '@/shared/schemas/compare';
import { CompareTable, MonoText, RowName, TableEntry, TableLine, type Column } from './compare-table';
import { signedQuantity } from './compare-view';
import { movedOutputOptions } from './queries';

export type MovedOutputPanelProps = {
  craftId: string;
  from: string;
  to: string;
  output: string;
  /** A key's label where the comparison knows it (other upstream changes are named by key). */
  labelOf: (key: string) => string;
  wide: boolean;
  onClose: () => void;
};

const columns: readonly Column[] = [
  { title: 'Changed input', style: { flex: 2.2, minWidth: 150 } },
  { title: 'Old → new', style: { flex: 2.2, minWidth: 150 }, numeric: true },
  { title: 'Share', style: { flex: 1.3, minWidth: 90 }, numeric: true },
  { title: 'Of the change', style: { flex: 1, minWidth: 80 }, numeric: true },
];

/** A share as a part of the whole change: "62.5 %"; "—" when the output did not change. */
function partOf(share: number, change: number): string {
  return change === 0 ? '—' : `${formatNumber((share / change) * 100, 3)} %`;
}

/** Shares largest first, whatever their sign: the input that moved the output most leads. */
function largestFirst(inputs: readonly InputShare[]): InputShare[] {
  return [...inputs].sort((a, b) => Math.abs(b.share) - Math.abs(a.share));
}

/** The parts the change is made of: the changed inputs, those the reader cannot see, and the remainder. */
type Part = { testID: string; label: string; detail: string; share: number; color: string; input?: InputShare };

function partsOf(moved: MovedOutput): Part[] {
  const inputs: Part[] = largestFirst(moved.inputs).map((input) => ({
    testID: `compare-share-${input.key}`,
    label: input.label,
    detail: `${formatQuantity(input.from, input.unit)} → ${formatQuantity(input.to, input.unit)}`,
    share: input.share,
    // The palette's accent for what raised the output, its ink for what lowered it.
    color: input.share >= 0 ? colors.film : colors.ink,
    input,
  }));
  const hidden: Part[] =
    moved.hiddenShare === undefined
      ? []
      : [
          {
            testID: 'compare-hidden-share',
            label: 'Changed inputs in rows you cannot see',
            detail: '',
            share: moved.hiddenShare,
            color: colors.inkFaint,
          },
        ];
  const remainder: Part = {
    testID: 'compare-remainder',
    label: 'Remainder: the inputs together, and other changes upstream',
    detail: '',
    share: moved.remainder,
    color: colors.inkFaint,
  };
  return [...inputs, ...hidden, remainder];
}

function MovedOutputBody({ moved, labelOf, wide }: { moved: MovedOutput; labelOf: (key: string) => string; wide: boolean }) {
  const parts = partsOf(moved);
  const format = (value: number) => signedQuantity(value, moved.unit);
  const unit = formatUnit(moved.unit);
  return (
    <>
      <MonoText testID="compare-moved-change">
        {`${formatQuantity(moved.from, moved.unit)} → ${formatQuantity(moved.to, moved.unit)}: change ${format(moved.change)}`}
      </MonoText>
      {moved.inputs.length === 0 ? (
        <AppText variant="muted" testID="compare-moved-no-inputs">
          No input upstream of it changed value.
        </AppText>
      ) : null}
      <ShareBars
        title={`What moved ${labelOf(moved.key)}`}
        shares={parts.map((part): Share => ({ label: part.label, value: part.share, color: part.color }))}
        valueLabel={unit === '' ? 'Share of the change' : `Share of the change (${unit})`}
        categoryLabel="Changed input, largest share first"
        formatValue={format}
        testID="compare-moved-chart"
      />
      {wide ? (
        <CompareTable columns={columns}>
          {parts.map((part) => (
            <TableEntry key={part.testID} testID={part.testID}>
              <TableLine
                columns={columns}
                cells={[
                  part.input === undefined ? part.label : <RowName key="name" label={part.label} rowKey={part.input.key} />,
                  part.detail,
                  format(part.share),
                  partOf(part.share, moved.change),
                ]}
              />
            </TableEntry>
          ))}
        </CompareTable>
      ) : (
        <View style={styles.list}>
          {parts.map((part) => (
            <View key={part.testID} style={styles.part} testID={part.testID}>
              {part.input === undefined ? <AppText>{part.label}</AppText> : <RowName label={part.label} rowKey={part.input.key} />}
              {part.detail === '' ? null : <MonoText>{part.detail}</MonoText>}
              <MonoText>{`${format(part.share)} (${partOf(part.share, moved.change)})`}</MonoText>
            </View>
          ))}
        </View>
      )}
      {moved.otherChanges.length > 0 ? (
        <View style={styles.list} testID="compare-moved-other">
          <AppText variant="label">Other changes upstream (part of the remainder)</AppText>
          {moved.otherChanges.map((change) => (
            <AppText key={`${change.key} ${change.reason}`} testID={`compare-other-${change.key}`}>
              {labelOf(change.key)} ({change.key}): {change.reason}
            </AppText>
          ))}
        </View>
      ) : null}
    </>
  );
}

/**
 * What moved one output: the changed inputs upstream of it, each with its share of the change (the output
 * now minus the output with that input alone at its old value) as bars and a table, then the remainder and
 * the other changes upstream with their reasons.
 */
export function MovedOutputPanel({ craftId, from, to, output, labelOf, wide, onClose }: MovedOutputPanelProps) {
  const moved = useQuery(movedOutputOptions(craftId, from, to, output));
  let body;
  if (moved.isPending) body = <LoadingState label={`Working out what moved ${labelOf(output)}…`} />;
  else if (moved.isError) {
    const missing = moved.error instanceof ApiError && moved.error.status === 404;
    body = (
      <ErrorState
        title={missing ? `No output “${output}” in the newer revision` : `Cannot say what moved ${labelOf(output)}`}
        message={missing ? 'The newer revision has no such row, or you may not see it.' : moved.error.message}
        onRetry={missing ? undefined : () => void moved.refetch()}
      />
    );
  } else if (moved.data === undefined) {
    body = <AppText variant="muted">The server did not say what moved this output.</AppText>;
  } else body = <MovedOutputBody moved={moved.data} labelOf={labelOf} wide={wide} />;
  return (
    <Card testID="compare-moved">
      <View style={styles.header}>
        <AppText variant="heading" style={styles.title}>
          What moved {labelOf(output)}
        </AppText>
        <Button label="Close" tone="quiet" onPress={onClose} testID="compare-moved-close" />
      </View>
      {body}
    </Card>
  );
}

const styles = StyleSheet.create({
  header: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
  title: { flexShrink: 1 },
  list: { gap: space.sm },
  part: { gap: 2, paddingTop: space.xs, borderTopWidth: StyleSheet.hairlineWidth, borderTopColor: colors.rule },
});
