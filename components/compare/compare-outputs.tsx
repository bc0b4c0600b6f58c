import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import type { OutputChange } from '@/shared/schemas/compare';
import { CompareTable, MonoText, RowName, TableEntry, TableLine, type Column } from './compare-table';
import { newOutputText, oldOutputText, outputChangeText, outputNote, percentText } from './compare-view';

export type CompareOutputsProps = {
  outputs: readonly OutputChange[];
  /** The output whose movers are shown, if any: its button reads as chosen. */
  picked: string | undefined;
  onPick: (key: string) => void;
  wide: boolean;
};

const columns: readonly Column[] = [
  { title: 'Output', style: { flex: 2.2, minWidth: 150 } },
  { title: 'Subsystem', style: { flex: 1.2, minWidth: 90 } },
  { title: 'Old', style: { flex: 1.2, minWidth: 90 }, numeric: true },
  { title: 'New', style: { flex: 1.2, minWidth: 90 }, numeric: true },
  { title: 'Change', style: { flex: 1.2, minWidth: 90 }, numeric: true },
  { title: 'Change %', style: { flex: 0.9, minWidth: 72 }, numeric: true },
  { title: 'What moved it', style: { width: 116 } },
];

function PickButton({ output, picked, onPick }: { output: OutputChange; picked: boolean; onPick: (key: string) => void }) {
  return (
    <Button
      label={picked ? 'Shown' : 'What moved it'}
      aria-label={`What moved ${output.label}`}
      aria-pressed={picked}
      tone={picked ? 'secondary' : 'quiet'}
      onPress={() => onPick(output.key)}
      testID={`compare-pick-${output.key}`}
    />
  );
}

function OutputName({ output }: { output: OutputChange }) {
  const note = outputNote(output);
  return (
    <View>
      <RowName label={output.label} rowKey={output.key} />
      {note !== undefined ? <AppText variant="error">{note}</AppText> : null}
    </View>
  );
}

/** Every output of the two revisions (after the filters): old and new value, absolute and relative change. */
export function CompareOutputs({ outputs, picked, onPick, wide }: CompareOutputsProps) {
  if (outputs.length === 0) {
    return (
      <AppText variant="muted" testID="compare-outputs-none">
        No output matches the filters.
      </AppText>
    );
  }
  if (wide) {
    return (
      <CompareTable columns={columns} testID="compare-outputs-table">
        {outputs.map((output) => (
          <TableEntry key={output.key} testID={`compare-output-${output.key}`}>
            <TableLine
              columns={columns}
              cells={[
                <OutputName key="name" output={output} />,
                output.subsystem,
                oldOutputText(output),
                newOutputText(output),
                outputChangeText(output),
                percentText(output.changePercent),
                <PickButton key="pick" output={output} picked={picked === output.key} onPick={onPick} />,
              ]}
            />
          </TableEntry>
        ))}
      </CompareTable>
    );
  }
  return (
    <View style={styles.cards}>
      {outputs.map((output) => (
        <Card key={output.key} testID={`compare-output-${output.key}`}>
          <OutputName output={output} />
          <AppText variant="muted">{output.subsystem}</AppText>
          <MonoText>{`${oldOutputText(output)} → ${newOutputText(output)}`}</MonoText>
          <MonoText>{`Change ${outputChangeText(output)} (${percentText(output.changePercent)})`}</MonoText>
          <View style={styles.start}>
            <PickButton output={output} picked={picked === output.key} onPick={onPick} />
          </View>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  cards: { gap: space.sm },
  start: { alignSelf: 'flex-start' },
});
